import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute } from 'sequelize'
import type { VehicleSpec } from '../../shared/schemas/vehicle-spec'
import type { KitFit } from '../../shared/schemas/kit'
import type { Platform } from './platform'

export class Kit extends Model<InferAttributes<Kit>, InferCreationAttributes<Kit>> {
  declare id: CreationOptional<number>
  declare workshopId: number
  declare name: string
  declare platformId: number
  declare fits: KitFit[]
  declare specTemplate: VehicleSpec
  declare baselineProfileId: CreationOptional<number | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare platform?: NonAttribute<Platform>

  static initModel(sequelize: Sequelize) {
    Kit.init({
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      platformId: { type: DataTypes.INTEGER, allowNull: false },
      fits: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      specTemplate: { type: DataTypes.JSONB, allowNull: false },
      baselineProfileId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE
    }, { sequelize, tableName: 'kits' })
  }
}
