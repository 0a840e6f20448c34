import type { SettingValues } from '../../shared/compute/parameter-input'
import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute } from 'sequelize'
import type { ReadbackSource } from '../../shared/schemas/readback'
import type { Profile } from './profile'
import type { ProfileVersion } from './profile-version'
import type { User } from './user'

// What the car's controller was found to hold, compared with the signed-off version.
export class Readback extends Model<InferAttributes<Readback>, InferCreationAttributes<Readback>> {
  declare id: CreationOptional<number>
  declare workshopId: number
  declare vehicleId: number
  declare profileId: number
  declare versionId: number | null
  declare parameters: SettingValues
  declare matches: boolean
  declare differences: CreationOptional<{ parameter: string, expected: unknown, found: unknown }[]>
  declare recordedById: number
  declare source: CreationOptional<ReadbackSource>
  declare readAt: CreationOptional<Date | null>
  declare controller: CreationOptional<{ serial?: string, firmware?: string }>
  declare createdAt: CreationOptional<Date>
  declare recordedBy?: NonAttribute<User>
  declare profile?: NonAttribute<Profile>
  declare version?: NonAttribute<ProfileVersion | null>

  static initModel(sequelize: Sequelize) {
    Readback.init({
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: false },
      vehicleId: { type: DataTypes.INTEGER, allowNull: false },
      profileId: { type: DataTypes.INTEGER, allowNull: false },
      versionId: { type: DataTypes.INTEGER, allowNull: true },
      parameters: { type: DataTypes.JSONB, allowNull: false },
      matches: { type: DataTypes.BOOLEAN, allowNull: false },
      differences: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      recordedById: { type: DataTypes.INTEGER, allowNull: false },
      source: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'typed' },
      readAt: { type: DataTypes.DATE, allowNull: true },
      controller: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      createdAt: DataTypes.DATE
    }, { sequelize, tableName: 'readbacks', updatedAt: false })
  }
}
