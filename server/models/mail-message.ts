import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize'

// A message waiting in (or delivered from) the outbox; written in the same transaction as its cause.
export class MailMessage extends Model<InferAttributes<MailMessage>, InferCreationAttributes<MailMessage>> {
  declare id: CreationOptional<number>
  declare workshopId: number | null
  declare to: string
  declare subject: string
  declare text: string
  declare html: CreationOptional<string | null>
  declare state: CreationOptional<'pending' | 'sent' | 'failed'>
  declare attempts: CreationOptional<number>
  declare lastError: CreationOptional<string | null>
  declare nextAttemptAt: CreationOptional<Date>
  declare sentAt: CreationOptional<Date | null>
  declare createdAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    MailMessage.init({
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: true },
      to: { type: DataTypes.TEXT, allowNull: false },
      subject: { type: DataTypes.TEXT, allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false },
      html: { type: DataTypes.TEXT, allowNull: true },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'pending' },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      lastError: { type: DataTypes.TEXT, allowNull: true },
      nextAttemptAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      sentAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE
    }, { sequelize, tableName: 'mail_outbox', updatedAt: false })
  }
}
