// Runs once when the server starts: the import worker resumes what a restart interrupted, and the
// overdue-reminder interval starts.
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { startImportWorker } = await import('./lib/server/import-worker');
    // A server must still answer when the worker cannot start (say, migrations not yet run).
    await startImportWorker().catch((err) => console.error('The import worker did not start. Has `npm run db:migrate` run?', err));
    // Overdue work orders send their assignee a reminder, at most once a day.
    const { startReminderInterval } = await import('./lib/services/work-orders');
    startReminderInterval();
  }
}
