/**
 * npm run bench [-- --small]: every benchmark in turn (import, analysis, review, API under load),
 * one table of figures, ratios and targets, appended to bench-results/history.jsonl with the date
 * and commit and compared with the last run. Benchmarks print; they never fail a build.
 */
import { report, type Figure } from './bench/common';
import { runAnalysis } from './bench-analysis';
import { runApi } from './bench-api';
import { runImport } from './bench-import';
import { runReview } from './bench-review';

async function main() {
  const small = process.argv.includes('--small');
  const figures: Figure[] = [];
  for (const [name, run] of [['import', runImport], ['analysis', runAnalysis], ['review', runReview], ['api', runApi]] as const) {
    console.log(`\n== bench:${name} ==`);
    const t0 = performance.now();
    figures.push(...(await run({ small })));
    console.log(`(bench:${name} took ${((performance.now() - t0) / 1000).toFixed(0)} s)`);
  }
  report(figures);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
