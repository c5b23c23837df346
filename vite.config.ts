/// <reference types="vitest/config" />
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression } from 'vite-plugin-compression2';

const alias = {
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
  '@': fileURLToPath(new URL('./src', import.meta.url)),
};

const apiPort = Number(process.env.API_PORT ?? 3001);

export default defineConfig({
  // The build writes a brotli and a gzip copy beside each text asset; the server sends the one the
  // browser accepts (server/app.ts), so nothing is compressed per request.
  plugins: [
    react(),
    tailwindcss(),
    compression({ algorithms: ['brotliCompress', 'gzip'], exclude: [/\.map$/], threshold: 1024 }),
  ],
  resolve: { alias },
  server: {
    port: 5173,
    host: '127.0.0.1',
    watch: { ignored: ['**/.data/**', '**/test-output/**'] },
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  build: { outDir: 'dist', sourcemap: true, chunkSizeWarningLimit: 1500 },
  worker: { format: 'es' },
  test: {
    // Three layers: pure engine and reference checks, API against a real
    // PostgreSQL, and browser flows against the built client.
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          // Generous: the suite shares the machine with builds and browsers; speed is
          // measured by the benchmarks, never asserted here.
          testTimeout: 60_000,
          include: [
            'tests/unit/**/*.test.ts',
            'tests/reference/**/*.test.ts',
            'shared/**/*.test.ts',
          ],
          environment: 'node',
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts', 'server/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/global-setup.ts'],
          setupFiles: ['tests/support/setup-env.ts'],
          pool: 'forks',
          fileParallelism: false,
          hookTimeout: 60_000,
          testTimeout: 30_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/global-setup.ts'],
          setupFiles: ['tests/support/setup-env.ts'],
          pool: 'forks',
          fileParallelism: false,
          hookTimeout: 120_000,
          testTimeout: 120_000,
        },
      },
    ],
  },
});
