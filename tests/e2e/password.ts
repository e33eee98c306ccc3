export const E2E_PASSWORD = 'e2e-demo-password';
