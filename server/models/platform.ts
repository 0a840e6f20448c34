import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize'

export class Platform extends Model<InferAttributes<Platform>, InferCreationAttributes<Platform>> {
  declare id: CreationOptional<number>
  declare workshopId: number | null
  declare key: string
  declare name: string
  declare motorMaxRpm: number
  declare torqueConstantNmPerA: CreationOptional<number | null>
  declare schema: Record<string, unknown>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    Platform.init({
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: true },
      key: { type: DataTypes.TEXT, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      motorMaxRpm: { type: DataTypes.INTEGER, allowNull: false },
      torqueConstantNmPerA: { type: DataTypes.DOUBLE, allowNull: true },
      schema: { type: DataTypes.JSONB, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE
    }, { sequelize, tableName: 'platforms' })
  }
}
