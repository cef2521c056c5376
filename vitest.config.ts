// Test runner settings: one global build of the CLI bundle before any integration test spawns it.
import { defineConfig } from 'vitest/config';

export const config = defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    globalSetup: ['test/globalSetup.ts'],
    testTimeout: 60_000,
    hookTimeout: 300_000,
    pool: 'forks',
    reporters: ['default', 'json'],
    outputFile: { json: 'test-output/vitest.json' },
  },
});

export default config;
