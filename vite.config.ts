import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { fileURLToPath } from 'node:url';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));

export const aliases = {
  '@shared': here('./shared'),
  '@server': here('./server/src'),
  '@client': here('./client/src'),
};

export default defineConfig({
  root: here('./client'),
  publicDir: false,
  plugins: [react(), tailwindcss()],
  resolve: { alias: aliases },
  server: {
    host: '127.0.0.1',
    fs: { allow: [here('.')] },
  },
  build: {
    outDir: here('./dist/client'),
    emptyOutDir: true,
    sourcemap: true,
  },
});
