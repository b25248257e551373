import { defineConfig } from 'vitest/config';
import path from 'node:path';

// Unit tests need nothing running; integration tests expect the test cluster,
// SMTP fake and object store that `npm test` (scripts/skywell.mjs) starts.
export default defineConfig({
  resolve: {
    alias: {
      '@': path.resolve(__dirname),
      // "server-only" throws outside a React server bundle; under vitest it is a no-op.
      'server-only': path.resolve(__dirname, 'tests/support/server-only-stub.ts'),
    },
  },
  test: {
    include: ['tests/**/*.test.ts'],
    environment: 'node',
    testTimeout: 30_000,
    hookTimeout: 60_000,
    fileParallelism: false,
    pool: 'forks',
    // Frames queued by the tests expire after 6 s, so a killed worker's frames come back to the
    // queue quickly (the worker processes of tests/support/workers.ts use the same values).
    env: { RENDER_FRAME_TIMEOUT_SECONDS: '6', QUEUE_MAINTENANCE_SECONDS: '1' },
  },
});
