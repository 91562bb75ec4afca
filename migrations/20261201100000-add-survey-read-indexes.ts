import type { QueryInterface } from 'sequelize';

// Reads of a survey of 200,000 tests over 20,000 traps (npm run bench:api):
// - tests_survey_role_trap: the review queue and the survey figures take each trap's latest
//   trap-point test and its count per trap from the index alone (GROUP BY trap_id, MAX(started_at)),
//   then read only those rows; the references' trap ids come from it too. It starts with the
//   columns of tests_survey_role_match, which it replaces.
// - tests_site_survey_started: the test list filters by site and survey; the count and the page
//   walk this index instead of reading every row of the survey (each row holds its figures JSON).
// - tests_survey_updated, trap_verdicts_survey_updated, traps_site_updated: the newest change of a
//   survey's tests and decisions and of a site's register, each one index lookup, so derived
//   figures can be kept until the data under them changes (lib/services/derived-cache.ts).
//   traps_site_updated also serves the register sorted by last change.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.addIndex('tests', ['survey_id', 'role', 'match_status', 'trap_id', 'started_at'], { name: 'tests_survey_role_trap' });
  await q.removeIndex('tests', 'tests_survey_role_match');
  await q.addIndex('tests', ['site_id', 'survey_id', 'started_at', 'id'], { name: 'tests_site_survey_started' });
  await q.addIndex('tests', ['survey_id', 'updated_at'], { name: 'tests_survey_updated' });
  await q.addIndex('trap_verdicts', ['survey_id', 'updated_at'], { name: 'trap_verdicts_survey_updated' });
  await q.addIndex('traps', ['site_id', 'updated_at'], { name: 'traps_site_updated' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.removeIndex('traps', 'traps_site_updated');
  await q.removeIndex('trap_verdicts', 'trap_verdicts_survey_updated');
  await q.removeIndex('tests', 'tests_survey_updated');
  await q.removeIndex('tests', 'tests_site_survey_started');
  await q.addIndex('tests', ['survey_id', 'role', 'match_status'], { name: 'tests_survey_role_match' });
  await q.removeIndex('tests', 'tests_survey_role_trap');
}
