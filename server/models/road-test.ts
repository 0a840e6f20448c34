import type { RecordedCheck } from '../../shared/schemas/workshop-checks'
import type { PreDriveRecord } from '../../shared/schemas/road-test-cautions'
import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize'

export interface RoadTestCheck { key: string, verdict: 'pass' | 'fail' | 'not-tested', values: Record<string, number | string | null>, note: string }
export interface RoadTestConditions { surface: 'dry' | 'wet' | 'snow', ambientC: number, route: string }
export interface RoadTestSignature { testerId: number, at: string, contentHash: string }

export class RoadTest extends Model<InferAttributes<RoadTest>, InferCreationAttributes<RoadTest>> {
  declare id: CreationOptional<number>
  declare workshopId: number
  declare vehicleId: number
  declare versionId: number
  declare testerId: number
  declare testedAt: Date
  declare conditions: RoadTestConditions
  declare checks: RoadTestCheck[]
  declare checkList: CreationOptional<RecordedCheck[]> // the workshop's own checks as they stood when recorded
  declare verdict: 'pass' | 'fail'
  declare preDrive: CreationOptional<PreDriveRecord | null> // the tester's tick before setting off; none on older records
  declare signed: CreationOptional<RoadTestSignature | null>
  declare idempotencyKey: CreationOptional<string | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    RoadTest.init({
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      workshopId: { type: DataTypes.INTEGER, allowNull: false },
      vehicleId: { type: DataTypes.INTEGER, allowNull: false },
      versionId: { type: DataTypes.INTEGER, allowNull: false },
      testerId: { type: DataTypes.INTEGER, allowNull: false },
      testedAt: { type: DataTypes.DATE, allowNull: false },
      conditions: { type: DataTypes.JSONB, allowNull: false },
      checks: { type: DataTypes.JSONB, allowNull: false },
      checkList: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      verdict: { type: DataTypes.TEXT, allowNull: false },
      preDrive: { type: DataTypes.JSONB, allowNull: true },
      signed: { type: DataTypes.JSONB, allowNull: true },
      idempotencyKey: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE
    }, { sequelize, tableName: 'road_tests' })
  }
}
