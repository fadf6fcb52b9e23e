import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    // Bundles dist/cli.js once, so the end-to-end tests run the current source.
    globalSetup: ['test/setup/buildOnce.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
  },
});
