import type { SettingValues } from '../../shared/compute/parameter-input'
import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute } from 'sequelize'
import type { VersionState, VersionOrigin } from '../../shared/schemas/version'
import type { Profile } from './profile'
import type { User } from './user'

export class ProfileVersion extends Model<InferAttributes<ProfileVersion>, InferCreationAttributes<ProfileVersion>> {
  declare id: CreationOptional<number>
  declare workshopId: number
  declare profileId: number
  declare versionNo: number
  declare parentVersionId: number | null
  declare baselineVersionId: CreationOptional<number | null>
  declare parameters: SettingValues
  declare rationale: CreationOptional<string>
  declare authorId: number
  declare state: CreationOptional<VersionState>
  declare origin: CreationOptional<VersionOrigin>
  declare roadTestId: CreationOptional<number | null>
  declare evaluation: CreationOptional<Record<string, unknown> | null>
  declare justifications: CreationOptional<Record<string, string>>
  declare contentHash: string
  declare lockVersion: CreationOptional<number>
  declare submittedAt: CreationOptional<Date | null>
  declare decidedAt: CreationOptional<Date | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare profile?: NonAttribute<Profile>
  declare author?: NonAttribute<User>

  static initModel(sequelize: Sequelize) {
    ProfileVersion.init({
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: false },
      profileId: { type: DataTypes.INTEGER, allowNull: false },
      versionNo: { type: DataTypes.INTEGER, allowNull: false },
      parentVersionId: { type: DataTypes.INTEGER, allowNull: true },
      baselineVersionId: { type: DataTypes.INTEGER, allowNull: true },
      parameters: { type: DataTypes.JSONB, allowNull: false },
      rationale: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      authorId: { type: DataTypes.INTEGER, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
      origin: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'workshop' },
      roadTestId: { type: DataTypes.INTEGER, allowNull: true },
      evaluation: { type: DataTypes.JSONB, allowNull: true },
      justifications: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      contentHash: { type: DataTypes.TEXT, allowNull: false },
      lockVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      submittedAt: { type: DataTypes.DATE, allowNull: true },
      decidedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE
    }, { sequelize, tableName: 'profile_versions' })
  }
}
