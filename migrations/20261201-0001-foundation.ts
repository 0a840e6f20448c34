import type { MigrationFn } from 'umzug'
import { DataTypes, literal, type QueryInterface } from 'sequelize'

const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }
const stamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') },
  updatedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') }
}
const ref = (table: string, allowNull = false) => ({ type: DataTypes.INTEGER, allowNull, references: { model: table, key: 'id' } })

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('workshops', {
    id,
    name: { type: DataTypes.TEXT, allowNull: false },
    settings: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    ...stamps
  })
  await qi.createTable('users', {
    id,
    workshopId: ref('workshops'),
    email: { type: DataTypes.TEXT, allowNull: false, unique: true },
    name: { type: DataTypes.TEXT, allowNull: false },
    passwordHash: { type: DataTypes.TEXT, allowNull: false },
    roles: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    ...stamps
  })
  await qi.addIndex('users', ['workshopId'])
  await qi.sequelize.query(`ALTER TABLE users ADD CONSTRAINT users_email_lower CHECK (email = lower(email))`)
  await qi.createTable('platforms', {
    id,
    workshopId: ref('workshops', true),
    key: { type: DataTypes.TEXT, allowNull: false, unique: true },
    name: { type: DataTypes.TEXT, allowNull: false },
    motorMaxRpm: { type: DataTypes.INTEGER, allowNull: false },
    schema: { type: DataTypes.JSONB, allowNull: false },
    ...stamps
  })
  await qi.createTable('vehicles', {
    id,
    workshopId: ref('workshops'),
    stockRef: { type: DataTypes.TEXT, allowNull: false },
    make: { type: DataTypes.TEXT, allowNull: false },
    model: { type: DataTypes.TEXT, allowNull: false },
    year: { type: DataTypes.INTEGER, allowNull: false },
    chassisNumber: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    registration: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    ownerUserId: ref('users', true),
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'intake' },
    spec: { type: DataTypes.JSONB, allowNull: false },
    platformId: ref('platforms'),
    ...stamps
  })
  await qi.addIndex('vehicles', ['workshopId', 'stockRef'], { unique: true })
  await qi.addIndex('vehicles', ['ownerUserId'])
  await qi.sequelize.query(`ALTER TABLE vehicles ADD CONSTRAINT vehicles_status CHECK (status IN ('intake', 'converting', 'road-testing', 'snagging', 'handed-over'))`)
  await qi.createTable('login_attempts', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    ip: { type: DataTypes.TEXT, allowNull: false },
    email: { type: DataTypes.TEXT, allowNull: false },
    succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') }
  })
  await qi.addIndex('login_attempts', ['ip', 'createdAt'])
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  for (const t of ['login_attempts', 'vehicles', 'platforms', 'users', 'workshops']) await qi.dropTable(t)
}
