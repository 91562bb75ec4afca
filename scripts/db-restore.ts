// npm run db:restore -- <backup folder> [target directory]: restores a backup made by db:backup into a
// fresh directory, checks row counts and file hashes against its manifest, and says how to point the app at it.
import path from 'node:path';
import { restoreBackup, stamp } from '@/lib/server/backup';

async function main() {
  const [folder, targetArg] = process.argv.slice(2);
  if (!folder) {
    console.error('Usage: npm run db:restore -- <backup folder> [target directory]');
    process.exit(2);
  }
  const target = path.resolve(targetArg ?? path.join('data', `restored-${stamp()}`));
  const { database, store, manifest } = await restoreBackup(path.resolve(folder), target);
  console.log(`Restored the backup of ${manifest.createdAt} into ${target}: ${Object.keys(manifest.tables).length} tables and ${manifest.files.length} files, every count and SHA-256 checked.`);
  console.log('Point the app at it with:');
  console.log(`  PLUMEWARD_DB=${database} PLUMEWARD_STORE=${store} npm start`);
}

main().catch((err) => {
  console.error(`Restore failed: ${(err as Error).message}`);
  process.exit(1);
});
