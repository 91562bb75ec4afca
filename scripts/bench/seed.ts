// Seeding helpers for the benchmark workers (they import lib/db, so only child processes with
// PLUMEWARD_DB pointing at a throwaway file use them).
import { sequelize } from '@/lib/db';
import { migrator, seeder } from '@/lib/migrator';
import { processUpload } from '@/lib/server/process-upload';
import { storeBytes } from '@/lib/server/upload-store';
import { Site, SourceFile, Upload, User } from '@/models';
import { DEMO_USERS } from '@/seeders/demo-scenario';

/** The real migrations and the demo seed (users, sites, profiles, demo surveys), as the app tier's setup does. */
export async function migrateAndSeed() {
  await migrator(sequelize).up();
  await seeder(sequelize).up();
  const analyst = (await User.findOne({ where: { email: DEMO_USERS.find((u) => u.role === 'analyst')!.email } }))!;
  const site = (await Site.findOne({ where: { code: 'FV' } }))!;
  return { analyst, site };
}

/** Stores files as the upload route would have and runs the server's import over them. */
export async function importFiles(siteId: number, surveyId: number, createdBy: number, files: { name: string; bytes: Uint8Array }[]) {
  const upload = await Upload.create({ siteId, surveyId, createdBy, status: 'queued', filesTotal: files.length });
  const rows = [];
  for (const f of files) {
    rows.push({
      uploadId: upload.id, siteId, surveyId, containerId: null, name: f.name, entry: null,
      kind: 'file' as const, sha256: await storeBytes(f.bytes), size: f.bytes.length, status: 'pending' as const, profileId: null, duplicateOf: null, hints: [],
    });
  }
  await SourceFile.bulkCreate(rows);
  await processUpload(upload.id);
  return (await Upload.findByPk(upload.id))!;
}
