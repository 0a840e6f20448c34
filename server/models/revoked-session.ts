import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize'

// A signed-out session: its sealed cookie, wherever a copy of it went, no longer signs anyone in.
export class RevokedSession extends Model<InferAttributes<RevokedSession>, InferCreationAttributes<RevokedSession>> {
  declare sessionId: string
  declare userId: number
  declare revokedAt: CreationOptional<Date>
  declare expiresAt: Date

  static initModel(sequelize: Sequelize) {
    RevokedSession.init({
      sessionId: { type: DataTypes.TEXT, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      revokedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      expiresAt: { type: DataTypes.DATE, allowNull: false }
    }, { sequelize, tableName: 'revoked_sessions', timestamps: false })
  }
}
