// Child process of bench:api: a throwaway database with the demo seed, plus 20,000 traps and
// 200,000 tests in one survey of the demo's first site, bulk-inserted through the models. Each
// test's figures and packed series are copied from a real test the demo seed imported, so the
// rows are in the stored format the app reads (many tests share a few series' bytes).
//   seed-api-worker.ts <traps> <tests>
import { Op, type CreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db';
import { Area, SourceFile, Survey, Test, TestSeries, Trap, Upload } from '@/models';
import { migrateAndSeed } from './seed';

const CHUNK = 2000;

async function main() {
  const [trapCount, testCount] = process.argv.slice(2).map(Number);
  const { analyst, site } = await migrateAndSeed();
  const areas = await Area.findAll({ where: { siteId: site.id } });
  const survey = await Survey.create({ siteId: site.id, name: 'Bench load survey', startsOn: '2025-05-01', endsOn: '2025-05-31' });
  const templates = await Test.findAll({ where: { role: 'trap', meanLevelDb: { [Op.ne]: null } }, order: [['id', 'ASC']], limit: 12 });
  const series = new Map((await TestSeries.findAll({ where: { testId: { [Op.in]: templates.map((t) => t.id) } } })).map((s) => [s.testId, s]));
  const anyFile = (await SourceFile.findOne({ where: { kind: 'file' } }))!;
  const upload = await Upload.create({ siteId: site.id, surveyId: survey.id, createdBy: analyst.id, status: 'done', filesTotal: 1, filesDone: 1, testCount, finishedAt: new Date() });
  const file = await SourceFile.create({
    uploadId: upload.id, siteId: site.id, surveyId: survey.id, containerId: null, name: 'A_bench_load.csv', entry: null, kind: 'file',
    sha256: anyFile.sha256, size: anyFile.size, status: 'processed', profileId: anyFile.profileId, duplicateOf: null, hints: [],
  });

  const t0 = performance.now();
  const firstTrapId = ((await Trap.max<number, Trap>('id')) ?? 0) + 1;
  const types = ['thermodynamic_disc', 'inverted_bucket', 'float_thermostatic', 'thermostatic_balanced_pressure'] as const;
  for (let i = 0; i < trapCount; i += CHUNK) {
    const rows: CreationAttributes<Trap>[] = [];
    for (let k = i; k < Math.min(trapCount, i + CHUNK); k++) {
      rows.push({
        id: firstTrapId + k, siteId: site.id, areaId: areas.length ? areas[k % areas.length].id : null, tag: `LD-${String(k).padStart(5, '0')}`,
        location: `Bench bay ${k % 97}`, trapType: types[k % types.length] as never, pressureBarg: 2 + (k % 12), sizeDn: 15 + 5 * (k % 4), orificeMm: null,
      });
    }
    await sequelize.transaction((transaction) => Trap.bulkCreate(rows, { transaction }));
  }
  const firstTestId = ((await Test.max<number, Test>('id')) ?? 0) + 1;
  const perTrap = Math.max(1, Math.floor(testCount / trapCount));
  const start = Date.UTC(2025, 4, 1, 6);
  for (let i = 0; i < testCount; i += CHUNK) {
    const tests: CreationAttributes<Test>[] = [];
    const blobs: CreationAttributes<TestSeries>[] = [];
    for (let k = i; k < Math.min(testCount, i + CHUNK); k++) {
      const tpl = templates[k % templates.length];
      const trapIndex = Math.floor(k / perTrap) % trapCount;
      const s = series.get(tpl.id)!;
      tests.push({
        id: firstTestId + k, siteId: site.id, surveyId: survey.id, uploadId: upload.id, sourceFileId: file.id, trapId: firstTrapId + trapIndex,
        tag: `LD-${String(trapIndex).padStart(5, '0')}`, role: tpl.role, linkedTrapTag: null, matchStatus: 'matched' as const,
        startedAt: new Date(start + k * 30_000), durationS: tpl.durationS, sampleRateHz: tpl.sampleRateHz, sampleCount: tpl.sampleCount,
        firstLine: 2, lastLine: tpl.sampleCount + 1, meanLevelDb: tpl.meanLevelDb, dutyCycle: tpl.dutyCycle, suggestedVerdict: tpl.suggestedVerdict,
        confidence: tpl.confidence, lossKgPerHour: tpl.lossKgPerHour, figures: tpl.figures,
      });
      blobs.push({ testId: firstTestId + k, levelDb: s.levelDb, temperatureC: s.temperatureC, timeOffsetsS: s.timeOffsetsS });
    }
    await sequelize.transaction(async (transaction) => {
      await Test.bulkCreate(tests, { transaction });
      await TestSeries.bulkCreate(blobs, { transaction });
    });
  }
  const seconds = (performance.now() - t0) / 1000;
  const traps = await Trap.count({ where: { siteId: site.id } });
  const stored = await Test.count({ where: { surveyId: survey.id } });
  await sequelize.close();
  console.log(JSON.stringify({ siteId: site.id, surveyId: survey.id, traps, tests: stored, insertSeconds: seconds }));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
