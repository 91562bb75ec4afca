import { DataTypes, type QueryInterface } from 'sequelize';
import { id, reference, timestamps } from './columns';

export async function up({ context: q }: { context: QueryInterface }) {
  // The analyst's decision on one trap in one survey. Absent: the trap is not yet reviewed and
  // its suggested verdict is read from its latest trap-point test.
  await q.createTable('trap_verdicts', {
    id,
    site_id: reference('sites', 'CASCADE'),
    survey_id: reference('surveys', 'CASCADE'),
    trap_id: reference('traps', 'CASCADE'),
    test_id: reference('tests', 'SET NULL', true),
    state: { type: DataTypes.STRING(16), allowNull: false },
    suggested: { type: DataTypes.STRING(24), allowNull: true },
    verdict: { type: DataTypes.STRING(24), allowNull: true },
    reason: { type: DataTypes.TEXT, allowNull: true },
    decided_by: reference('users', 'SET NULL', true),
    decided_at: { type: DataTypes.DATE, allowNull: true },
    retest_requested_at: { type: DataTypes.DATE, allowNull: true },
    retest_requested_by: reference('users', 'SET NULL', true),
    ...timestamps,
  });
  await q.addIndex('trap_verdicts', ['survey_id', 'trap_id'], { unique: true, name: 'trap_verdicts_survey_trap' });
  await q.addIndex('trap_verdicts', ['trap_id'], { name: 'trap_verdicts_trap' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('trap_verdicts');
}
