import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('.', import.meta.url));
const alias = { '@': root };

// Two tiers, both run by `npm test`:
//  unit — pure code in lib/, no database, no server;
//  app  — a real SQLite file, the real migrations, the built app served over HTTP, real Chromium.
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['tests/lib/**/*.test.ts'],
          setupFiles: ['tests/setup/server-only-stub.ts'],
          environment: 'node',
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'app',
          include: ['tests/integration/**/*.test.ts', 'tests/browser/**/*.test.ts'],
          setupFiles: ['tests/setup/server-only-stub.ts'],
          globalSetup: ['tests/setup/app-server.ts'],
          environment: 'node',
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
