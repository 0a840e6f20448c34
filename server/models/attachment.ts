import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize'

// A file in object storage; the key is random, never derived from ids.
export class Attachment extends Model<InferAttributes<Attachment>, InferCreationAttributes<Attachment>> {
  declare id: CreationOptional<number>
  declare workshopId: number
  declare ownerType: 'road-test' | 'snag' | 'telemetry'
  declare ownerId: number
  declare objectKey: string
  declare filename: string
  declare contentType: string
  declare bytes: number
  declare sha256: string
  declare uploadedBy: number
  declare thumbnailKey: CreationOptional<string | null>
  declare caption: CreationOptional<string>
  declare createdAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    Attachment.init({
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: false },
      ownerType: { type: DataTypes.TEXT, allowNull: false },
      ownerId: { type: DataTypes.INTEGER, allowNull: false },
      objectKey: { type: DataTypes.TEXT, allowNull: false },
      filename: { type: DataTypes.TEXT, allowNull: false },
      contentType: { type: DataTypes.TEXT, allowNull: false },
      bytes: { type: DataTypes.BIGINT, allowNull: false },
      sha256: { type: DataTypes.TEXT, allowNull: false },
      uploadedBy: { type: DataTypes.INTEGER, allowNull: false },
      thumbnailKey: { type: DataTypes.TEXT, allowNull: true },
      caption: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      createdAt: DataTypes.DATE
    }, { sequelize, tableName: 'attachments', updatedAt: false })
  }
}
