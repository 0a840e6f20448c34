import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize'

export class Snag extends Model<InferAttributes<Snag>, InferCreationAttributes<Snag>> {
  declare id: CreationOptional<number>
  declare workshopId: number
  declare vehicleId: number
  declare roadTestId: CreationOptional<number | null>
  declare kind: 'conversion' | 'remedial' | 'enhancement'
  declare title: string
  declare detail: CreationOptional<string>
  declare priority: CreationOptional<'low' | 'normal' | 'high' | 'urgent'>
  declare status: CreationOptional<'open' | 'in-hand' | 'done' | 'declined'>
  declare assigneeId: CreationOptional<number | null>
  declare blocking: CreationOptional<boolean>
  declare createdById: number
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    Snag.init({
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: false },
      vehicleId: { type: DataTypes.INTEGER, allowNull: false },
      roadTestId: { type: DataTypes.INTEGER, allowNull: true },
      kind: { type: DataTypes.TEXT, allowNull: false },
      title: { type: DataTypes.TEXT, allowNull: false },
      detail: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      priority: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'normal' },
      status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'open' },
      assigneeId: { type: DataTypes.INTEGER, allowNull: true },
      blocking: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdById: { type: DataTypes.INTEGER, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE
    }, { sequelize, tableName: 'snags' })
  }
}
