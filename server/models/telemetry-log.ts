import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize'

export class TelemetryLog extends Model<InferAttributes<TelemetryLog>, InferCreationAttributes<TelemetryLog>> {
  declare id: CreationOptional<number>
  declare workshopId: number
  declare roadTestId: number
  declare attachmentId: number
  declare sampleCount: number
  declare summary: Record<string, number | null>
  declare series: CreationOptional<Record<string, number[]> | null>
  declare createdAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    TelemetryLog.init({
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: false },
      roadTestId: { type: DataTypes.INTEGER, allowNull: false },
      attachmentId: { type: DataTypes.INTEGER, allowNull: false },
      sampleCount: { type: DataTypes.INTEGER, allowNull: false },
      summary: { type: DataTypes.JSONB, allowNull: false },
      series: { type: DataTypes.JSONB, allowNull: true },
      createdAt: DataTypes.DATE
    }, { sequelize, tableName: 'telemetry_logs', updatedAt: false })
  }
}
