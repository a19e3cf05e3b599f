import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig, searchForWorkspaceRoot } from 'vite';

const webRoot = fileURLToPath(new URL('.', import.meta.url));
const fontsDir = fileURLToPath(new URL('../fonts', import.meta.url));
const apiPort = process.env.API_PORT ?? '3000';

export default defineConfig({
  plugins: [react()],
  resolve: {
    alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) },
  },
  css: {
    preprocessorOptions: {
      scss: {
        // Bootstrap 5.3 is still written with @import and global functions.
        quietDeps: true,
        silenceDeprecations: ['import', 'global-builtin', 'color-functions'],
      },
    },
  },
  server: {
    host: '127.0.0.1',
    proxy: {
      '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false },
    },
    fs: {
      allow: [searchForWorkspaceRoot(webRoot), webRoot, fontsDir],
    },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
  },
});
