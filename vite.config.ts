import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { fileURLToPath } from 'node:url';

const apiPort = Number(process.env.API_PORT ?? 3001);

export default defineConfig(({ command }) => ({
  plugins: [react(), tailwindcss()],
  resolve: {
    alias: {
      // React Router 7 points every import condition at its development build; the production build
      // (the same code with its development warnings switched off) is what a built client should ship.
      ...(command === 'build'
        ? {
            'react-router/dom': fileURLToPath(new URL('./node_modules/react-router/dist/production/dom-export.mjs', import.meta.url)),
            'react-router': fileURLToPath(new URL('./node_modules/react-router/dist/production/index.mjs', import.meta.url)),
          }
        : {}),
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  build: {
    outDir: 'dist',
    sourcemap: false,
    chunkSizeWarningLimit: 700,
  },
}));
