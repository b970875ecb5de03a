import { defineConfig } from 'vitest/config';

// The system suite: tests that need programs from Debian's packages (a SPARQL server, a browser).
// `.ci/run` installs them and runs `npm run test:system` after `npm test`.
export default defineConfig({
  test: {
    include: ['test/system/**/*.test.ts'],
    exclude: ['node_modules/**'],
    testTimeout: 300_000,
    hookTimeout: 300_000,
    fileParallelism: false,
  },
});
