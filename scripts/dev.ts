/** `npm run dev`: the API on :3001 (no static client) and Vite's dev server on :5173 proxying /api to it. */
import { spawn } from 'node:child_process';

const api = spawn('npx', ['tsx', 'watch', 'server/index.ts'], {
  stdio: 'inherit',
  env: { ...process.env, PORT: process.env.API_PORT ?? '3001', SERVE_CLIENT: 'false', PUBLIC_URL: 'http://127.0.0.1:5173' },
});
const web = spawn('npx', ['vite'], { stdio: 'inherit', env: process.env });
const stop = () => {
  api.kill();
  web.kill();
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
api.on('exit', stop);
web.on('exit', stop);
