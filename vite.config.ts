import vue from '@vitejs/plugin-vue';
import { defineConfig } from 'vitest/config';

const apiPort = Number(process.env.PORT ?? 3000);

export default defineConfig({
  plugins: [vue()],
  build: { outDir: 'dist/client', chunkSizeWarningLimit: 1500 },
  server: {
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  test: {
    include: ['tests/**/*.test.ts'],
    testTimeout: 30_000,
    hookTimeout: 120_000,
    // API and browser tests share one database; files run one after another.
    fileParallelism: false,
  },
});
