// Child process of bench:import: a day of files stored into a throwaway SQLite database through
// the server's own import (lib/server/process-upload.ts). PLUMEWARD_DB and PLUMEWARD_STORE name the
// throwaway files; lib/db reads them when first imported, hence a process of its own.
//   import-store-worker.ts <files> <samples>
import { headerFingerprint } from '@/lib/import/header-fingerprint';
import { sequelize } from '@/lib/db';
import { migrator } from '@/lib/migrator';
import { processUpload } from '@/lib/server/process-upload';
import { storeBytes } from '@/lib/server/upload-store';
import { InstrumentProfile, Site, SourceFile, Survey, Test, TestSeries, Trap, Upload } from '@/models';
import { benchTrap, dayOfFiles, modelAProfile } from './meter-text';

async function main() {
  const [files, samples] = process.argv.slice(2).map(Number);
  await migrator(sequelize).up();
  const site = await Site.create({ name: 'Bench works', code: 'BW', timeZone: 'UTC', currency: 'EUR', unitSystem: 'si' });
  const survey = await Survey.create({ siteId: site.id, name: 'Bench day', startsOn: '2025-04-08', endsOn: '2025-04-08' });
  const d = modelAProfile();
  const fingerprint = d.fingerprint ?? headerFingerprint({ delimiter: d.delimiter, header: d.header, preambleKeys: d.preambleKeys, unitsRow: d.unitsRow });
  await InstrumentProfile.create({ name: 'Model A', fingerprint, definition: { ...d, name: 'Model A', fingerprint }, createdBy: null } as never);
  const day = dayOfFiles(files, samples);
  await Trap.bulkCreate(day.map((f) => { const { id: _id, ...t } = benchTrap(f.tag); return { ...t, siteId: site.id, areaId: null }; }));
  // Receiving (streaming to disk, hashing) is the upload route's part; the import starts from stored files.
  const queue = async (surveyId: number, part: typeof day) => {
    const upload = await Upload.create({ siteId: site.id, surveyId, createdBy: null, status: 'queued', filesTotal: part.length });
    const rows = [];
    for (const f of part) {
      rows.push({
        uploadId: upload.id, siteId: site.id, surveyId, containerId: null, name: f.name, entry: null,
        kind: 'file' as const, sha256: await storeBytes(f.bytes), size: f.bytes.length, status: 'pending' as const, profileId: null, duplicateOf: null, hints: [],
      });
    }
    await SourceFile.bulkCreate(rows);
    return upload;
  };
  // A server has imported before: a first, small upload (into a survey of its own) warms the
  // code up, as papaparse is warm in the parent by its second round.
  const warmUp = await Survey.create({ siteId: site.id, name: 'Warm-up', startsOn: '2025-04-07', endsOn: '2025-04-07' });
  await processUpload((await queue(warmUp.id, day.slice(0, Math.ceil(day.length / 10)))).id);
  const upload = await queue(survey.id, day);
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  await processUpload(upload.id);
  const seconds = (performance.now() - t0) / 1000;
  // CPU time of all the process's threads (the driver's too): steadier than wall time on a busy machine.
  const cpu = process.cpuUsage(cpu0);
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  const done = (await Upload.findByPk(upload.id))!;
  const tests = await Test.count({ where: { uploadId: upload.id } });
  const series = await TestSeries.count({ include: [{ model: Test, required: true, where: { uploadId: upload.id } }] });
  await sequelize.close();
  console.log(JSON.stringify({ seconds, cpuSeconds, status: done.status, tests, series, samples: done.sampleCount, error: done.error }));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
