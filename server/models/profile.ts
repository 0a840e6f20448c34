import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute } from 'sequelize'
import type { ProfileVersion } from './profile-version'

export class Profile extends Model<InferAttributes<Profile>, InferCreationAttributes<Profile>> {
  declare id: CreationOptional<number>
  declare workshopId: number
  declare vehicleId: number | null
  declare kitId: CreationOptional<number | null>
  declare name: string
  declare onCarVersionId: CreationOptional<number | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare versions?: NonAttribute<ProfileVersion[]>

  static initModel(sequelize: Sequelize) {
    Profile.init({
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: false },
      vehicleId: { type: DataTypes.INTEGER, allowNull: true },
      kitId: { type: DataTypes.INTEGER, allowNull: true },
      name: { type: DataTypes.TEXT, allowNull: false },
      onCarVersionId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE
    }, { sequelize, tableName: 'profiles' })
  }
}
