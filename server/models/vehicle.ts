import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute } from 'sequelize'
import type { VehicleSpec } from '../../shared/schemas/vehicle-spec'
import type { VehicleStatus } from '../../shared/schemas/vehicle'
import type { Platform } from './platform'
import type { User } from './user'

export class Vehicle extends Model<InferAttributes<Vehicle>, InferCreationAttributes<Vehicle>> {
  declare id: CreationOptional<number>
  declare workshopId: number
  declare stockRef: string
  declare make: string
  declare model: string
  declare year: number
  declare chassisNumber: CreationOptional<string>
  declare registration: CreationOptional<string>
  declare ownerUserId: number | null
  declare status: CreationOptional<VehicleStatus>
  declare spec: VehicleSpec
  declare platformId: number
  declare kitId: CreationOptional<number | null>
  declare driftedAt: CreationOptional<Date | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare platform?: NonAttribute<Platform>
  declare owner?: NonAttribute<User | null>

  static initModel(sequelize: Sequelize) {
    Vehicle.init({
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: false },
      stockRef: { type: DataTypes.TEXT, allowNull: false },
      make: { type: DataTypes.TEXT, allowNull: false },
      model: { type: DataTypes.TEXT, allowNull: false },
      year: { type: DataTypes.INTEGER, allowNull: false },
      chassisNumber: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      registration: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      ownerUserId: { type: DataTypes.INTEGER, allowNull: true },
      status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'intake' },
      spec: { type: DataTypes.JSONB, allowNull: false },
      platformId: { type: DataTypes.INTEGER, allowNull: false },
      kitId: { type: DataTypes.INTEGER, allowNull: true },
      driftedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE
    }, { sequelize, tableName: 'vehicles' })
  }
}
