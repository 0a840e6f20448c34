import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize'

// Sign-in attempts live in PostgreSQL so every server instance sees the same rate limit.
export class LoginAttempt extends Model<InferAttributes<LoginAttempt>, InferCreationAttributes<LoginAttempt>> {
  declare id: CreationOptional<number>
  declare ip: string
  declare email: string
  declare succeeded: boolean
  declare createdAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    LoginAttempt.init({
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      ip: { type: DataTypes.TEXT, allowNull: false },
      email: { type: DataTypes.TEXT, allowNull: false },
      succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
      createdAt: DataTypes.DATE
    }, { sequelize, tableName: 'login_attempts', updatedAt: false })
  }
}
