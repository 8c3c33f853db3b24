import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    setupFiles: ['test/setup/fail-on-console.ts'],
    // onnxruntime sessions and worker threads are native; forks isolate them per file.
    pool: 'forks',
    testTimeout: 120_000,
    hookTimeout: 120_000,
  },
});
