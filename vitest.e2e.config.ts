import { defineConfig } from 'vitest/config';
import path from 'node:path';

// Browser tests against the server `npm test` starts (E2E_BASE_URL); one file at a time, they share the app and its data.
export default defineConfig({
  resolve: { alias: { '@': path.resolve(import.meta.dirname), 'server-only': path.resolve(import.meta.dirname, 'tests/support/server-only.ts') } },
  test: {
    include: ['tests/e2e/**/*.test.ts'],
    environment: 'node',
    fileParallelism: false,
    testTimeout: 90_000,
    hookTimeout: 120_000,
    teardownTimeout: 30_000,
  },
});
