import type { MigrationFn } from 'umzug'
import { DataTypes, literal, type QueryInterface } from 'sequelize'

const ref = (table: string, allowNull = false) => ({ type: DataTypes.INTEGER, allowNull, references: { model: table, key: 'id' } })

// Conversion kits: a drive unit, the cars it fits, a spec template and a baseline profile. The baseline is
// an ordinary profile owned by the kit instead of a car (exactly one of the two), so its versions go through
// the same draft, review and approval; each car version remembers the baseline version it was built from.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('kits', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    workshopId: ref('workshops'),
    name: { type: DataTypes.TEXT, allowNull: false },
    platformId: ref('platforms'),
    fits: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    specTemplate: { type: DataTypes.JSONB, allowNull: false },
    baselineProfileId: ref('profiles', true),
    createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') },
    updatedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') }
  })
  await qi.addIndex('kits', ['workshopId', 'name'], { unique: true })
  await qi.addColumn('profiles', 'kitId', ref('kits', true))
  await qi.changeColumn('profiles', 'vehicleId', { type: DataTypes.INTEGER, allowNull: true })
  await qi.sequelize.query(`ALTER TABLE profiles ADD CONSTRAINT profiles_car_or_kit CHECK (("vehicleId" IS NULL) <> ("kitId" IS NULL))`)
  await qi.sequelize.query('CREATE UNIQUE INDEX profiles_one_baseline_per_kit ON profiles ("kitId") WHERE "kitId" IS NOT NULL')
  await qi.addColumn('profile_versions', 'baselineVersionId', ref('profile_versions', true))
  await qi.addColumn('vehicles', 'kitId', ref('kits', true))
  await qi.addIndex('vehicles', ['kitId'])
}

// Versions are never deleted, so going back is refused while a kit has a baseline.
export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  const [rows] = await qi.sequelize.query('SELECT 1 FROM profiles WHERE "kitId" IS NOT NULL LIMIT 1')
  if (rows.length) throw new Error('Kits with baseline versions exist; their history cannot be removed.')
  await qi.removeColumn('vehicles', 'kitId')
  await qi.removeColumn('profile_versions', 'baselineVersionId')
  await qi.sequelize.query('ALTER TABLE profiles DROP CONSTRAINT profiles_car_or_kit')
  await qi.removeColumn('profiles', 'kitId')
  await qi.changeColumn('profiles', 'vehicleId', { type: DataTypes.INTEGER, allowNull: false })
  await qi.dropTable('kits')
}
