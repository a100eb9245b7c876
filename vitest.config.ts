import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';

// Two projects: fast pure/unit tests (shared solver, client components) and
// server integration tests that need the real local MariaDB (global setup
// recreates the test database and runs the migrations once per run).
export default defineConfig({
  test: {
    projects: [
      {
        extends: true,
        plugins: [react()],
        test: {
          name: 'unit',
          include: ['shared/**/*.test.ts', 'src/**/*.test.{ts,tsx}', 'tools/**/*.test.ts'],
          environment: 'node',
          setupFiles: ['src/test/setup.ts'],
        },
      },
      {
        extends: true,
        test: {
          name: 'server',
          include: ['server/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['server/test/global-setup.ts'],
          setupFiles: ['server/test/setup.ts'],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
