import type { QueryInterface } from 'sequelize';

// The test list (lib/services/tests.ts listTests) filters by site and survey and pages in start
// order. With only (survey_id, trap_id) SQLite sorted every test of the survey, figures and all, for
// each page: 1.7 s a page at 20,000 tests under load (npm run bench:api). These let it walk the
// index in order and stop after one page.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.addIndex('tests', ['survey_id', 'started_at', 'id'], { name: 'tests_survey_started' });
  await q.addIndex('tests', ['site_id', 'started_at', 'id'], { name: 'tests_site_started' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.removeIndex('tests', 'tests_site_started');
  await q.removeIndex('tests', 'tests_survey_started');
}
