import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// One file configures the client build and the three test projects:
// unit (pure shared/ and machines/), api (Supertest against a private MariaDB)
// and e2e (Chromium against the built client served by the real server).
export default defineConfig({
  plugins: [react(), tailwindcss()],
  build: { outDir: 'dist', emptyOutDir: true, chunkSizeWarningLimit: 900 },
  server: {
    port: 5173,
    proxy: {
      '/api': {
        target: 'http://127.0.0.1:5180',
        // The API accepts only its own public address as Origin; this dev page is that API's client.
        configure: (proxy) => proxy.on('proxyReq', (request) => request.getHeader('origin') && request.setHeader('origin', 'http://127.0.0.1:5180')),
      },
    },
  },
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/shared/**/*.test.ts', 'tests/machines/**/*.test.ts'],
          environment: 'node',
          // Property tests run thousands of cases; a busy 2-core CI machine needs the headroom.
          testTimeout: 30_000,
        },
      },
      {
        test: {
          name: 'api',
          include: ['tests/server/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/helpers/api-global-setup.ts'],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      // Fault tests start their own MariaDB and app processes per file (several minutes):
      // only `npm run test:faults` turns the project on, so `npm test` leaves it out.
      ...(process.env.WHORL_FAULT_TESTS === '1'
        ? [
            {
              test: {
                name: 'faults',
                include: ['tests/faults/**/*.test.ts'],
                environment: 'node',
                fileParallelism: false,
                testTimeout: 180_000,
                hookTimeout: 120_000,
              },
            },
          ]
        : []),
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/helpers/e2e-global-setup.ts'],
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 180_000,
          // expect.poll gives up after 1 s by default: too short for a list to refetch on a busy machine.
          expect: { poll: { timeout: 15_000 } },
        },
      },
    ],
  },
});
