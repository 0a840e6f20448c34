// Every model, initialised on one connection, with the associations wired in one place.
import type { Sequelize } from 'sequelize'
import { Workshop } from './workshop'
import { User } from './user'
import { Platform } from './platform'
import { Vehicle } from './vehicle'
import { LoginAttempt } from './login-attempt'
import { RevokedSession } from './revoked-session'
import { Profile } from './profile'
import { ProfileVersion } from './profile-version'
import { Review } from './review'
import { MailMessage } from './mail-message'
import { RoadTest } from './road-test'
import { Snag } from './snag'
import { Attachment } from './attachment'
import { TelemetryLog } from './telemetry-log'
import { Readback } from './readback'
import { WorkshopCheck } from './workshop-check'
import { Kit } from './kit'

export { Workshop, User, Platform, Vehicle, LoginAttempt, RevokedSession, Profile, ProfileVersion, Review, MailMessage, RoadTest, Snag, Attachment, TelemetryLog, Readback, WorkshopCheck, Kit }

const all = [Workshop, User, Platform, Vehicle, LoginAttempt, RevokedSession, Profile, ProfileVersion, Review, MailMessage, RoadTest, Snag, Attachment, TelemetryLog, Readback, WorkshopCheck, Kit]

export function initModels(sequelize: Sequelize) {
  for (const model of all) model.initModel(sequelize)
  User.belongsTo(Workshop, { foreignKey: 'workshopId', as: 'workshop' })
  Vehicle.belongsTo(Platform, { foreignKey: 'platformId', as: 'platform' })
  Vehicle.belongsTo(User, { foreignKey: 'ownerUserId', as: 'owner' })
  Vehicle.belongsTo(Workshop, { foreignKey: 'workshopId', as: 'workshop' })
  Vehicle.hasMany(Profile, { foreignKey: 'vehicleId', as: 'profiles' })
  Profile.belongsTo(Vehicle, { foreignKey: 'vehicleId', as: 'vehicle' })
  Profile.hasMany(ProfileVersion, { foreignKey: 'profileId', as: 'versions' })
  Profile.belongsTo(ProfileVersion, { foreignKey: 'onCarVersionId', as: 'onCarVersion', constraints: false })
  ProfileVersion.belongsTo(Profile, { foreignKey: 'profileId', as: 'profile' })
  ProfileVersion.belongsTo(User, { foreignKey: 'authorId', as: 'author' })
  ProfileVersion.hasMany(Review, { foreignKey: 'versionId', as: 'reviews' })
  Review.belongsTo(User, { foreignKey: 'reviewerId', as: 'reviewer' })
  RoadTest.belongsTo(ProfileVersion, { foreignKey: 'versionId', as: 'version' })
  RoadTest.belongsTo(User, { foreignKey: 'testerId', as: 'tester' })
  RoadTest.hasMany(TelemetryLog, { foreignKey: 'roadTestId', as: 'telemetry' })
  Snag.belongsTo(User, { foreignKey: 'assigneeId', as: 'assignee' })
  Snag.belongsTo(Vehicle, { foreignKey: 'vehicleId', as: 'vehicle' })
  Kit.belongsTo(Platform, { foreignKey: 'platformId', as: 'platform' })
  Profile.belongsTo(Kit, { foreignKey: 'kitId', as: 'kit' })
  Readback.belongsTo(User, { foreignKey: 'recordedById', as: 'recordedBy' })
  Readback.belongsTo(Profile, { foreignKey: 'profileId', as: 'profile' })
  Readback.belongsTo(ProfileVersion, { foreignKey: 'versionId', as: 'version' })
}
