import { defineConfig } from 'vitest/config';

// Unit tests (no I/O) and integration tests (HTTP against the real PostgreSQL that
// scripts/test.ts starts) run in one vitest invocation; browser tests run after, from
// scripts/test.ts, against a built server.
export default defineConfig({
  test: {
    include: ['tests/unit/**/*.test.ts', 'tests/integration/**/*.test.ts'],
    environment: 'node',
    testTimeout: 30_000,
    hookTimeout: 60_000,
    fileParallelism: true,
    // Two cores here and in CI: one worker per core.
    maxWorkers: 2,
  },
});
