import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('.', import.meta.url));
const alias = { '@': root };

// The app tier runs a second time against PostgreSQL when PLUMEWARD_DATABASE_URL is set (.ci/run).
// These files test what only the SQLite installation has, and stay out of that run, each with why:
const SQLITE_ONLY: Record<string, string> = {
  'tests/integration/backup.test.ts': "db:backup/db:restore copy the SQLite file with SQLite's backup API; PostgreSQL is backed up with pg_dump (README)",
  'tests/integration/data-dir-faults.test.ts': 'fills the disk under the SQLite file and compares the file row by row (sqlite_master, rowid); a PostgreSQL server keeps its data elsewhere',
};
const onPostgres = Boolean(process.env.PLUMEWARD_DATABASE_URL);
if (onPostgres) {
  console.log(`App tier on PostgreSQL; left out as SQLite-only:\n${Object.entries(SQLITE_ONLY).map(([file, why]) => `  ${file}: ${why}`).join('\n')}`);
}

// Two tiers, both run by `npm test`:
//  unit — pure code in lib/, no database, no server;
//  app  — a real SQLite file (or PostgreSQL database), the real migrations, the built app served over HTTP, real Chromium.
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
          exclude: onPostgres ? Object.keys(SQLITE_ONLY) : [],
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
