import { defineConfig } from 'vitest/config';

// Three projects: pure code (no services), API against real PostgreSQL + Redis,
// and end-to-end in headless Chromium. The API and e2e suites share one database,
// so their files run one at a time and the groups run one after the other (groupOrder).
export default defineConfig({
  oxc: { decorator: { legacy: true, emitDecoratorMetadata: true } } as never,
  test: {
    projects: [
      { extends: true, test: { name: 'unit', sequence: { groupOrder: 0 }, include: ['tests/unit/**/*.test.ts', 'tests/references/**/*.test.ts'] } },
      {
        extends: true,
        test: { name: 'api', sequence: { groupOrder: 1 }, include: ['tests/api/**/*.test.ts'], fileParallelism: false, testTimeout: 30_000, hookTimeout: 60_000 },
      },
      {
        extends: true,
        test: { name: 'e2e', sequence: { groupOrder: 2 }, include: ['tests/e2e/**/*.test.ts'], fileParallelism: false, testTimeout: 120_000, hookTimeout: 120_000 },
      },
    ],
  },
});
