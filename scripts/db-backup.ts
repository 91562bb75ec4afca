// npm run db:backup [-- <folder>]: an online backup of the live database (SQLite's backup API)
// and the upload store, into a new timestamped folder (default: backups/ beside the database).
import path from 'node:path';
import { databasePath } from '@/lib/db';
import { createBackup, stamp } from '@/lib/server/backup';
import { storeRoot } from '@/lib/server/upload-store';

async function main() {
  const database = databasePath();
  const folder = path.resolve(process.argv[2] ?? path.join(path.dirname(database), 'backups', `plumeward-${stamp()}`));
  const m = await createBackup({ database, store: storeRoot(), folder });
  const rows = Object.values(m.tables).reduce((a, b) => a + b, 0);
  console.log(`Backed up ${database} (${Object.keys(m.tables).length} tables, ${rows} rows) and ${m.files.length} stored files from ${storeRoot()}`);
  console.log(`Backup folder: ${folder}`);
  console.log(`Restore with: npm run db:restore -- ${folder} <fresh directory>`);
}

main().catch((err) => {
  console.error(`Backup failed: ${(err as Error).message}`);
  process.exit(1);
});
