import { DataTypes, type QueryInterface } from 'sequelize';
import { id, reference, timestamps } from './columns';

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('instrument_profiles', {
    id,
    name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    fingerprint: { type: DataTypes.STRING(40), allowNull: false },
    definition: { type: DataTypes.JSON, allowNull: false },
    revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    created_by: reference('users', 'SET NULL', true),
    ...timestamps,
  });
  await q.addIndex('instrument_profiles', ['fingerprint'], { name: 'instrument_profiles_fingerprint' });

  await q.createTable('uploads', {
    id,
    site_id: reference('sites', 'CASCADE'),
    survey_id: reference('surveys', 'CASCADE'),
    created_by: reference('users', 'SET NULL', true),
    status: { type: DataTypes.STRING(24), allowNull: false },
    files_total: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    files_done: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    test_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    sample_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    error: { type: DataTypes.TEXT, allowNull: true },
    mapping_draft: { type: DataTypes.JSON, allowNull: true },
    started_at: { type: DataTypes.DATE, allowNull: true },
    finished_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('uploads', ['site_id', 'created_at'], { name: 'uploads_site_created' });
  await q.addIndex('uploads', ['status'], { name: 'uploads_status' });

  await q.createTable('source_files', {
    id,
    upload_id: reference('uploads', 'CASCADE'),
    site_id: reference('sites', 'CASCADE'),
    survey_id: reference('surveys', 'CASCADE'),
    container_id: reference('source_files', 'CASCADE', true),
    name: { type: DataTypes.STRING(500), allowNull: false },
    entry: { type: DataTypes.STRING(1000), allowNull: true },
    kind: { type: DataTypes.STRING(12), allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    size: { type: DataTypes.BIGINT, allowNull: false },
    status: { type: DataTypes.STRING(24), allowNull: false },
    fingerprint: { type: DataTypes.STRING(40), allowNull: true },
    profile_id: reference('instrument_profiles', 'SET NULL', true),
    profile_revision: { type: DataTypes.INTEGER, allowNull: true },
    detection: { type: DataTypes.JSON, allowNull: true },
    problems: { type: DataTypes.JSON, allowNull: true },
    row_counts: { type: DataTypes.JSON, allowNull: true },
    hints: { type: DataTypes.JSON, allowNull: true },
    test_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    duplicate_of: reference('source_files', 'SET NULL', true),
    ...timestamps,
  });
  await q.addIndex('source_files', ['upload_id'], { name: 'source_files_upload' });
  await q.addIndex('source_files', ['survey_id', 'sha256'], { name: 'source_files_survey_sha' });

  await q.createTable('tests', {
    id,
    site_id: reference('sites', 'CASCADE'),
    survey_id: reference('surveys', 'CASCADE'),
    upload_id: reference('uploads', 'CASCADE'),
    source_file_id: reference('source_files', 'CASCADE'),
    trap_id: reference('traps', 'SET NULL', true),
    tag: { type: DataTypes.STRING(80), allowNull: false },
    role: { type: DataTypes.STRING(12), allowNull: false },
    linked_trap_tag: { type: DataTypes.STRING(80), allowNull: true },
    match_status: { type: DataTypes.STRING(12), allowNull: false },
    started_at: { type: DataTypes.DATE, allowNull: false },
    duration_s: { type: DataTypes.FLOAT, allowNull: false },
    sample_rate_hz: { type: DataTypes.FLOAT, allowNull: false },
    sample_count: { type: DataTypes.INTEGER, allowNull: false },
    first_line: { type: DataTypes.INTEGER, allowNull: true },
    last_line: { type: DataTypes.INTEGER, allowNull: true },
    mean_level_db: { type: DataTypes.FLOAT, allowNull: true },
    duty_cycle: { type: DataTypes.FLOAT, allowNull: true },
    suggested_verdict: { type: DataTypes.STRING(24), allowNull: true },
    confidence: { type: DataTypes.STRING(8), allowNull: true },
    loss_kg_per_hour: { type: DataTypes.FLOAT, allowNull: true },
    figures: { type: DataTypes.JSON, allowNull: true },
    ...timestamps,
  });
  // The review queue and test lists filter by these on surveys of 200,000 tests.
  await q.addIndex('tests', ['survey_id', 'trap_id'], { name: 'tests_survey_trap' });
  await q.addIndex('tests', ['upload_id'], { name: 'tests_upload' });
  await q.addIndex('tests', ['trap_id', 'started_at'], { name: 'tests_trap_started' });
  await q.addIndex('tests', ['site_id', 'suggested_verdict'], { name: 'tests_site_verdict' });
  await q.addIndex('tests', ['source_file_id'], { name: 'tests_source_file' });

  // One packed row per test: Float32 level and temperature, Float64 offsets when irregular.
  await q.createTable('test_series', {
    test_id: { type: DataTypes.INTEGER, primaryKey: true, allowNull: false, references: { model: 'tests', key: 'id' }, onDelete: 'CASCADE' },
    level_db: { type: DataTypes.BLOB, allowNull: false },
    temperature_c: { type: DataTypes.BLOB, allowNull: true },
    time_offsets_s: { type: DataTypes.BLOB, allowNull: true },
  });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('test_series');
  await q.dropTable('tests');
  await q.dropTable('source_files');
  await q.dropTable('uploads');
  await q.dropTable('instrument_profiles');
}
