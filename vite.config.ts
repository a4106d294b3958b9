import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

export default defineConfig({
  root: '.',
  plugins: [react(), tailwindcss()],
  // Nothing inlined as data: URLs, so the Content-Security-Policy can allow fonts from 'self' only.
  build: { outDir: 'dist/client', emptyOutDir: true, sourcemap: false, assetsInlineLimit: 0 },
  server: {
    host: '127.0.0.1',
    port: Number(process.env.VITE_PORT ?? 5173),
    proxy: { '/api': `http://127.0.0.1:${process.env.PORT ?? 5180}` },
  },
});
