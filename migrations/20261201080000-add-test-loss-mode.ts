import { DataTypes, type QueryInterface } from 'sequelize';

// The loss mode the analysis chose (blow_through, leaking, rapid_cycling) as a column of its own,
// so survey figures need not read every test's figures JSON (200,000 tests in a survey).
export async function up({ context: q }: { context: QueryInterface }) {
  await q.addColumn('tests', 'loss_mode', { type: DataTypes.STRING(16), allowNull: true });
  await q.addIndex('tests', ['survey_id', 'role', 'match_status'], { name: 'tests_survey_role_match' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.removeIndex('tests', 'tests_survey_role_match');
  await q.removeColumn('tests', 'loss_mode');
}
