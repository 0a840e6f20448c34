import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute } from 'sequelize'
import type { User } from './user'

export class Review extends Model<InferAttributes<Review>, InferCreationAttributes<Review>> {
  declare id: CreationOptional<number>
  declare workshopId: number
  declare versionId: number
  declare reviewerId: number
  declare decision: 'approve' | 'reject'
  declare comment: CreationOptional<string>
  declare createdAt: CreationOptional<Date>
  declare reviewer?: NonAttribute<User>

  static initModel(sequelize: Sequelize) {
    Review.init({
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: false },
      versionId: { type: DataTypes.INTEGER, allowNull: false },
      reviewerId: { type: DataTypes.INTEGER, allowNull: false },
      decision: { type: DataTypes.TEXT, allowNull: false },
      comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      createdAt: DataTypes.DATE
    }, { sequelize, tableName: 'reviews', updatedAt: false })
  }
}
