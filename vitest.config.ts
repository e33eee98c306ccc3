import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

export default defineConfig({
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  test: {
    include: ['tests/unit/**/*.test.ts', 'tests/api/**/*.test.ts', 'tests/reference/**/*.test.ts'],
    environment: 'node',
    // API tests each open their own temporary SQLite file; a few workers keep two cores busy.
    pool: 'forks',
    testTimeout: 20000,
    hookTimeout: 30000,
  },
});
