// Runs once when the server starts: the import worker resumes what a restart interrupted.
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { startImportWorker } = await import('./lib/server/import-worker');
    // A server must still answer when the worker cannot start (say, migrations not yet run).
    await startImportWorker().catch((err) => console.error('The import worker did not start. Has `npm run db:migrate` run?', err));
  }
}
