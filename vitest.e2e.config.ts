import { defineConfig } from 'vitest/config';

// Browser tests: playwright-core drives Debian's chromium against a built, seeded server whose address is in
// E2E_BASE_URL (scripts/test.ts starts it). One file at a time: they share that server and its data.
export default defineConfig({
  test: {
    include: ['tests/e2e/**/*.test.ts'],
    environment: 'node',
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
