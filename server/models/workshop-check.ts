import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize'

export class WorkshopCheck extends Model<InferAttributes<WorkshopCheck>, InferCreationAttributes<WorkshopCheck>> {
  declare id: CreationOptional<number>
  declare workshopId: number
  declare key: string
  declare label: string
  declare record: 'pass-fail' | 'number'
  declare unit: CreationOptional<string | null>
  declare min: CreationOptional<number | null>
  declare max: CreationOptional<number | null>
  declare required: boolean
  declare platformKeys: CreationOptional<string[] | null>
  declare retiredAt: CreationOptional<Date | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    WorkshopCheck.init({
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: false },
      key: { type: DataTypes.TEXT, allowNull: false },
      label: { type: DataTypes.TEXT, allowNull: false },
      record: { type: DataTypes.TEXT, allowNull: false },
      unit: { type: DataTypes.TEXT, allowNull: true },
      min: { type: DataTypes.DOUBLE, allowNull: true },
      max: { type: DataTypes.DOUBLE, allowNull: true },
      required: { type: DataTypes.BOOLEAN, allowNull: false },
      platformKeys: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: true },
      retiredAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE
    }, { sequelize, tableName: 'workshop_checks' })
  }
}
