import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('.', import.meta.url));

export default defineConfig({
  resolve: {
    alias: [
      { find: /^@\//, replacement: `${root}/` },
      // Server-only modules are exercised directly by the integration tests.
      { find: /^server-only$/, replacement: `${root}/node_modules/server-only/empty.js` },
    ],
  },
  test: {
    include: ['lib/**/*.test.ts', 'components/**/*.test.ts', 'tests/**/*.test.ts'],
    environment: 'node',
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: 'forks',
    maxWorkers: 2,
  },
});
