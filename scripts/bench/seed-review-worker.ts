// Child process of bench:review: a throwaway database with the demo seed, plus a survey of
// 2,000 traps (one test each) and one test of 1.5 million samples, all made by the server's own
// import (processUpload), so every series is in the real stored format.
//   seed-review-worker.ts <traps> <bigSamples>
import { sequelize } from '@/lib/db';
import { Survey, Test, Trap } from '@/models';
import { benchTrap, DAY_START, HEADER, modelARows } from './meter-text';
import { importFiles, migrateAndSeed } from './seed';

async function main() {
  const [traps, bigSamples] = process.argv.slice(2).map(Number);
  const { analyst, site } = await migrateAndSeed();
  const survey = await Survey.create({ siteId: site.id, name: 'Bench review survey', startsOn: '2025-04-08', endsOn: '2025-04-10' });
  const tags = Array.from({ length: traps }, (_, i) => `RV-${String(i).padStart(4, '0')}`);
  await Trap.bulkCreate([...tags, 'RV-LONG'].map((tag) => { const { id: _id, ...t } = benchTrap(tag); return { ...t, siteId: site.id, areaId: null }; }));
  // One day file holding every trap's test (a tag change starts a new test), and one long test.
  const enc = new TextEncoder();
  const day = HEADER + tags.map((tag, i) => modelARows(tag, DAY_START + i * 60_000, 300, i + 1)).join('');
  const parts: string[] = [HEADER];
  for (let i = 0; i < bigSamples; i += 100_000) parts.push(modelARows('RV-LONG', DAY_START + 86_400_000 + i * 100, Math.min(100_000, bigSamples - i), i + 7));
  const upload = await importFiles(site.id, survey.id, analyst.id, [
    { name: 'A_bench_day.csv', bytes: enc.encode(day) },
    { name: 'A_RV-LONG.csv', bytes: enc.encode(parts.join('')) },
  ]);
  const long = await Test.findOne({ where: { surveyId: survey.id, tag: 'RV-LONG' } });
  const count = await Test.count({ where: { surveyId: survey.id } });
  await sequelize.close();
  console.log(JSON.stringify({ siteId: site.id, surveyId: survey.id, longTestId: long?.id ?? null, longSamples: long?.sampleCount ?? 0, tests: count, status: upload.status }));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
