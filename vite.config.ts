/// <reference types="vitest/config" />
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// One config for the client build, the dev server and every vitest project.
export default defineConfig({
  plugins: [react(), tailwindcss()],
  server: {
    port: 5173,
    proxy: { '/api': 'http://localhost:3000' },
  },
  build: { outDir: 'dist', sourcemap: true },
  test: {
    // Vitest's default on a 2-core machine is one worker (CPUs − 1); the tests spend much of
    // their time waiting on child processes, sockets and the database, so two keep both busy.
    maxWorkers: 2,
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          environment: 'node',
          include: ['tests/unit/**/*.test.ts'],
          // PDF and whole-building tests take a few seconds alone, more beside a second worker.
          testTimeout: 15000,
          // Pure modules: one import per worker instead of one per file (81 s → 26 s here).
          isolate: false,
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          environment: 'node',
          include: ['tests/api/**/*.test.ts'],
          testTimeout: 20000,
          hookTimeout: 20000,
        },
      },
      {
        extends: true,
        test: {
          name: 'ui',
          environment: 'jsdom',
          include: ['tests/ui/**/*.test.tsx'],
          setupFiles: ['tests/ui/setup.ts'],
          testTimeout: 15000,
          // One jsdom per worker, emptied by the setup file after each test (65 s → 21 s here).
          isolate: false,
        },
      },
    ],
  },
});
