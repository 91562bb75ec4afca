import { DataTypes, type QueryInterface } from 'sequelize';

// A count per survey of the writes to its tests (rows added, changed, removed), kept by the
// database itself whoever writes: the version under the review queue, the survey figures and the
// test list's total (lib/services/derived-cache.ts). One lookup instead of counting a survey's
// 200,000 tests on every request; exact where stamps are not (a removal moves no stamp, and a
// slow transaction may commit rows stamped before the newest ones already visible).
// SQLite has row triggers only; PostgreSQL counts once per statement from its transition tables.

const SQLITE = [
  `CREATE TRIGGER tests_count_insert AFTER INSERT ON tests BEGIN
     INSERT INTO survey_test_writes (survey_id, writes) VALUES (NEW.survey_id, 1)
       ON CONFLICT (survey_id) DO UPDATE SET writes = writes + 1;
   END`,
  `CREATE TRIGGER tests_count_update AFTER UPDATE ON tests BEGIN
     INSERT INTO survey_test_writes (survey_id, writes) VALUES (NEW.survey_id, 1)
       ON CONFLICT (survey_id) DO UPDATE SET writes = writes + 1;
     INSERT INTO survey_test_writes (survey_id, writes) SELECT OLD.survey_id, 1 WHERE OLD.survey_id <> NEW.survey_id
       ON CONFLICT (survey_id) DO UPDATE SET writes = writes + 1;
   END`,
  `CREATE TRIGGER tests_count_delete AFTER DELETE ON tests BEGIN
     INSERT INTO survey_test_writes (survey_id, writes) VALUES (OLD.survey_id, 1)
       ON CONFLICT (survey_id) DO UPDATE SET writes = writes + 1;
   END`,
];

// Surveys in id order, so two statements counting several surveys take their rows' locks alike.
const count = (rows: string) => `
  INSERT INTO survey_test_writes AS c (survey_id, writes)
    SELECT survey_id, COUNT(*) FROM (${rows}) AS changed GROUP BY survey_id ORDER BY survey_id
  ON CONFLICT (survey_id) DO UPDATE SET writes = c.writes + EXCLUDED.writes;
  RETURN NULL;`;

const POSTGRES = [
  `CREATE FUNCTION tests_count_rows() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN ${count('SELECT survey_id FROM changed_tests')} END $$`,
  `CREATE FUNCTION tests_count_updates() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN
     ${count('SELECT survey_id FROM changed_tests UNION ALL SELECT o.survey_id FROM old_tests o WHERE o.survey_id NOT IN (SELECT survey_id FROM changed_tests)')}
   END $$`,
  `CREATE TRIGGER tests_count_insert AFTER INSERT ON tests REFERENCING NEW TABLE AS changed_tests
     FOR EACH STATEMENT EXECUTE FUNCTION tests_count_rows()`,
  `CREATE TRIGGER tests_count_update AFTER UPDATE ON tests REFERENCING OLD TABLE AS old_tests NEW TABLE AS changed_tests
     FOR EACH STATEMENT EXECUTE FUNCTION tests_count_updates()`,
  `CREATE TRIGGER tests_count_delete AFTER DELETE ON tests REFERENCING OLD TABLE AS changed_tests
     FOR EACH STATEMENT EXECUTE FUNCTION tests_count_rows()`,
];

export async function up({ context: q }: { context: QueryInterface }) {
  // No reference to surveys: deleting a survey removes its tests, and their count is written while it goes.
  await q.createTable('survey_test_writes', {
    survey_id: { type: DataTypes.INTEGER, primaryKey: true, allowNull: false },
    writes: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
  });
  for (const sql of q.sequelize.getDialect() === 'postgres' ? POSTGRES : SQLITE) await q.sequelize.query(sql);
}

export async function down({ context: q }: { context: QueryInterface }) {
  for (const name of ['tests_count_delete', 'tests_count_update', 'tests_count_insert']) await q.sequelize.query(`DROP TRIGGER ${name}${q.sequelize.getDialect() === 'postgres' ? ' ON tests' : ''}`);
  if (q.sequelize.getDialect() === 'postgres') {
    await q.sequelize.query('DROP FUNCTION tests_count_updates()');
    await q.sequelize.query('DROP FUNCTION tests_count_rows()');
  }
  await q.dropTable('survey_test_writes');
}
