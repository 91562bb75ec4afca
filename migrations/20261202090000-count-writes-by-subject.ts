import { DataTypes, type QueryInterface } from 'sequelize';
import { up as countTestWritesUp } from './20261201100100-count-test-writes';

// A count of writes per subject, kept by the database itself whoever writes: the versions under
// the answers the app keeps between requests (lib/services/derived-cache.ts). One lookup per
// subject tells whether anything under an answer changed; exact where stamps are not (a removal
// moves no stamp, a slow transaction may commit rows stamped before the newest ones already
// visible). It replaces the count of a survey's test writes alone (survey_test_writes) and the
// counts and newest stamps of decisions, traps and areas read on every request before.
//
// Subjects: 'survey' (its row, its tests, its decisions), 'site' (its row, traps, areas, cost
// settings) and 'user-names' (one row, id 0: who decided is shown by name). A count only grows;
// its value means nothing but "changed".
// SQLite has row triggers only; PostgreSQL counts once per statement from its transition tables.

type Counted = { table: string; subject: 'survey' | 'site'; key: string };

const COUNTED: Counted[] = [
  { table: 'surveys', subject: 'survey', key: 'id' },
  { table: 'tests', subject: 'survey', key: 'survey_id' },
  { table: 'trap_verdicts', subject: 'survey', key: 'survey_id' },
  { table: 'sites', subject: 'site', key: 'id' },
  { table: 'traps', subject: 'site', key: 'site_id' },
  { table: 'areas', subject: 'site', key: 'site_id' },
  { table: 'site_cost_settings', subject: 'site', key: 'site_id' },
];

const bump = (subject: string, id: string, where = '') =>
  `INSERT INTO write_counts (subject, subject_id, writes) SELECT '${subject}', ${id}, 1${where ? ` WHERE ${where}` : ' WHERE true'}
     ON CONFLICT (subject, subject_id) DO UPDATE SET writes = writes + 1;`;

function sqliteTriggers({ table, subject, key }: Counted): string[] {
  return [
    `CREATE TRIGGER count_writes_${table}_insert AFTER INSERT ON ${table} BEGIN ${bump(subject, `NEW.${key}`)} END`,
    `CREATE TRIGGER count_writes_${table}_update AFTER UPDATE ON ${table} BEGIN
       ${bump(subject, `NEW.${key}`)}
       ${bump(subject, `OLD.${key}`, `OLD.${key} <> NEW.${key}`)}
     END`,
    `CREATE TRIGGER count_writes_${table}_delete AFTER DELETE ON ${table} BEGIN ${bump(subject, `OLD.${key}`)} END`,
  ];
}

const SQLITE_USERS = [
  `CREATE TRIGGER count_writes_users_insert AFTER INSERT ON users BEGIN ${bump('user-names', '0')} END`,
  `CREATE TRIGGER count_writes_users_name AFTER UPDATE OF name ON users BEGIN ${bump('user-names', '0')} END`,
  `CREATE TRIGGER count_writes_users_delete AFTER DELETE ON users BEGIN ${bump('user-names', '0')} END`,
];

// Subjects in id order, so two statements counting several take their rows' locks alike.
const countRows = (subject: string, rows: string) => `
  INSERT INTO write_counts AS c (subject, subject_id, writes)
    SELECT '${subject}', k, COUNT(*) FROM (${rows}) AS changed GROUP BY k ORDER BY k
  ON CONFLICT (subject, subject_id) DO UPDATE SET writes = c.writes + EXCLUDED.writes;`;

function postgresTriggers({ table, subject, key }: Counted): string[] {
  const fn = `count_writes_${table}`;
  return [
    `CREATE FUNCTION ${fn}() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN
       IF TG_OP = 'INSERT' THEN ${countRows(subject, `SELECT ${key} AS k FROM new_rows`)}
       ELSIF TG_OP = 'DELETE' THEN ${countRows(subject, `SELECT ${key} AS k FROM old_rows`)}
       ELSE ${countRows(subject, `SELECT ${key} AS k FROM new_rows UNION SELECT ${key} FROM old_rows`)}
       END IF;
       RETURN NULL;
     END $$`,
    `CREATE TRIGGER ${fn}_insert AFTER INSERT ON ${table} REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION ${fn}()`,
    `CREATE TRIGGER ${fn}_update AFTER UPDATE ON ${table} REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION ${fn}()`,
    `CREATE TRIGGER ${fn}_delete AFTER DELETE ON ${table} REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION ${fn}()`,
  ];
}

// Transition tables cannot go with a column list (UPDATE OF name), and the users' count needs no rows.
const POSTGRES_USERS = [
  `CREATE FUNCTION count_writes_users() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN ${countRows('user-names', 'SELECT 0 AS k')} RETURN NULL; END $$`,
  'CREATE TRIGGER count_writes_users_insert AFTER INSERT ON users FOR EACH STATEMENT EXECUTE FUNCTION count_writes_users()',
  'CREATE TRIGGER count_writes_users_name AFTER UPDATE OF name ON users FOR EACH STATEMENT EXECUTE FUNCTION count_writes_users()',
  'CREATE TRIGGER count_writes_users_delete AFTER DELETE ON users FOR EACH STATEMENT EXECUTE FUNCTION count_writes_users()',
];

const TABLES = [...COUNTED.map((c) => c.table), 'users'];

async function dropOldTestCount(q: QueryInterface, postgres: boolean) {
  for (const name of ['tests_count_delete', 'tests_count_update', 'tests_count_insert']) await q.sequelize.query(`DROP TRIGGER ${name}${postgres ? ' ON tests' : ''}`);
  if (postgres) {
    await q.sequelize.query('DROP FUNCTION tests_count_updates()');
    await q.sequelize.query('DROP FUNCTION tests_count_rows()');
  }
  await q.dropTable('survey_test_writes');
}

export async function up({ context: q }: { context: QueryInterface }) {
  const postgres = q.sequelize.getDialect() === 'postgres';
  await dropOldTestCount(q, postgres);
  // No references: a subject removed is counted while it goes.
  await q.createTable('write_counts', {
    subject: { type: DataTypes.STRING(16), primaryKey: true, allowNull: false },
    subject_id: { type: DataTypes.INTEGER, primaryKey: true, allowNull: false },
    writes: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
  });
  const statements = postgres
    ? [...COUNTED.flatMap(postgresTriggers), ...POSTGRES_USERS]
    : [...COUNTED.flatMap(sqliteTriggers), ...SQLITE_USERS];
  for (const sql of statements) await q.sequelize.query(sql);
  // The newest change of tests and decisions was read from these for the versions; nothing reads them now.
  await q.removeIndex('tests', 'tests_survey_updated');
  await q.removeIndex('trap_verdicts', 'trap_verdicts_survey_updated');
}

export async function down({ context: q }: { context: QueryInterface }) {
  const postgres = q.sequelize.getDialect() === 'postgres';
  await q.addIndex('trap_verdicts', ['survey_id', 'updated_at'], { name: 'trap_verdicts_survey_updated' });
  await q.addIndex('tests', ['survey_id', 'updated_at'], { name: 'tests_survey_updated' });
  for (const table of TABLES) {
    const events = table === 'users' ? ['insert', 'name', 'delete'] : ['insert', 'update', 'delete'];
    for (const event of events) await q.sequelize.query(`DROP TRIGGER count_writes_${table}_${event}${postgres ? ` ON ${table}` : ''}`);
    if (postgres) await q.sequelize.query(`DROP FUNCTION count_writes_${table}()`);
  }
  await q.dropTable('write_counts');
  await countTestWritesUp({ context: q });
}
