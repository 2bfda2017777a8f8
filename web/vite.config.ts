import { readFileSync } from 'node:fs';
import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

const API_ORIGIN = 'http://127.0.0.1:4600';

const rootPackage = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as {
  version: string;
};

export default defineConfig({
  root: import.meta.dirname,
  plugins: [react(), tailwindcss()],
  define: {
    __SHADOWLOOP_VERSION__: JSON.stringify(rootPackage.version),
  },
  server: {
    proxy: {
      '/api': { target: API_ORIGIN, changeOrigin: false },
      '/auth': { target: API_ORIGIN, changeOrigin: false },
      '/socket.io': { target: API_ORIGIN, ws: true, changeOrigin: false },
    },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
  },
});
