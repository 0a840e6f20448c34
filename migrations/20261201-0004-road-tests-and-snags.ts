import type { MigrationFn } from 'umzug'
import { DataTypes, literal, type QueryInterface } from 'sequelize'

const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }
const created = { createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') } }
const stamps = { ...created, updatedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') } }
const ref = (table: string, allowNull = false) => ({ type: DataTypes.INTEGER, allowNull, references: { model: table, key: 'id' } })

// Road tests, the snag list, uploaded files and telemetry, and controller read-backs (drift).
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('road_tests', {
    id,
    workshopId: ref('workshops'),
    vehicleId: ref('vehicles'),
    versionId: ref('profile_versions'),
    testerId: ref('users'),
    testedAt: { type: DataTypes.DATE, allowNull: false },
    conditions: { type: DataTypes.JSONB, allowNull: false },
    checks: { type: DataTypes.JSONB, allowNull: false },
    verdict: { type: DataTypes.TEXT, allowNull: false },
    signed: { type: DataTypes.JSONB, allowNull: true },
    ...stamps
  })
  await qi.addIndex('road_tests', ['versionId'])
  await qi.addIndex('road_tests', ['vehicleId'])
  await qi.sequelize.query(`
    ALTER TABLE road_tests ADD CONSTRAINT road_tests_verdict CHECK (verdict IN ('pass', 'fail'));
    ALTER TABLE profile_versions ADD CONSTRAINT profile_versions_road_test FOREIGN KEY ("roadTestId") REFERENCES road_tests(id);
  `)
  await qi.createTable('snags', {
    id,
    workshopId: ref('workshops'),
    vehicleId: ref('vehicles'),
    roadTestId: ref('road_tests', true),
    kind: { type: DataTypes.TEXT, allowNull: false },
    title: { type: DataTypes.TEXT, allowNull: false },
    detail: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    priority: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'normal' },
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'open' },
    assigneeId: ref('users', true),
    blocking: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    createdById: ref('users'),
    ...stamps
  })
  await qi.addIndex('snags', ['vehicleId', 'status'])
  await qi.addIndex('snags', ['workshopId', 'status'])
  await qi.sequelize.query(`
    ALTER TABLE snags ADD CONSTRAINT snags_kind CHECK (kind IN ('conversion', 'remedial', 'enhancement'));
    ALTER TABLE snags ADD CONSTRAINT snags_priority CHECK (priority IN ('low', 'normal', 'high', 'urgent'));
    ALTER TABLE snags ADD CONSTRAINT snags_status CHECK (status IN ('open', 'in-hand', 'done', 'declined'));
  `)
  await qi.createTable('attachments', {
    id,
    workshopId: ref('workshops'),
    ownerType: { type: DataTypes.TEXT, allowNull: false },
    ownerId: { type: DataTypes.INTEGER, allowNull: false },
    objectKey: { type: DataTypes.TEXT, allowNull: false, unique: true },
    filename: { type: DataTypes.TEXT, allowNull: false },
    contentType: { type: DataTypes.TEXT, allowNull: false },
    bytes: { type: DataTypes.BIGINT, allowNull: false },
    sha256: { type: DataTypes.TEXT, allowNull: false },
    uploadedBy: ref('users'),
    ...created
  })
  await qi.addIndex('attachments', ['ownerType', 'ownerId'])
  await qi.createTable('telemetry_logs', {
    id,
    workshopId: ref('workshops'),
    roadTestId: ref('road_tests'),
    attachmentId: ref('attachments'),
    sampleCount: { type: DataTypes.INTEGER, allowNull: false },
    summary: { type: DataTypes.JSONB, allowNull: false },
    ...created
  })
  await qi.addIndex('telemetry_logs', ['roadTestId'])
  await qi.createTable('readbacks', {
    id,
    workshopId: ref('workshops'),
    vehicleId: ref('vehicles'),
    profileId: ref('profiles'),
    versionId: ref('profile_versions', true),
    parameters: { type: DataTypes.JSONB, allowNull: false },
    matches: { type: DataTypes.BOOLEAN, allowNull: false },
    differences: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    recordedById: ref('users'),
    ...created
  })
  await qi.addIndex('readbacks', ['vehicleId', 'id'])
  await qi.addColumn('vehicles', 'driftedAt', { type: DataTypes.DATE, allowNull: true })
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeColumn('vehicles', 'driftedAt')
  for (const t of ['readbacks', 'telemetry_logs', 'attachments', 'snags']) await qi.dropTable(t)
  await qi.sequelize.query('ALTER TABLE profile_versions DROP CONSTRAINT profile_versions_road_test')
  await qi.dropTable('road_tests')
}
