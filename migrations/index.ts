// Every migration, in order. Nitro bundles the server, so they are listed here rather than globbed.
import * as foundation from './20261201-0001-foundation'
import * as auditEvents from './20261201-0002-audit-events'
import * as profilesAndReviews from './20261201-0003-profiles-and-reviews'
import * as roadTestsAndSnags from './20261201-0004-road-tests-and-snags'
import * as roadTestFiles from './20261201-0006-road-test-files'
import * as history from './20261201-0007-history'
import * as revokedSessions from './20261202-0008-revoked-sessions'
import * as platformKeys from './20261202-0009-platform-keys-per-workshop'
import * as sessionEpoch from './20261203-2001-session-epoch'
import * as historyForm2 from './20261203-3001-history-form-2'
import * as kits from './20261203-5001-kits'
import * as fleetRechecks from './20261203-5002-fleet-rechecks'
import * as onCarEvaluations from './20261203-5003-on-car-evaluations'
import * as roadTestIdempotency from './20261203-6001-road-test-idempotency'
import * as driveUnitRoles from './20261203-4001-drive-unit-roles'
import * as workshopChecks from './20261203-4003-workshop-checks'
import * as fleetSearchColumns from './20261203-7101-fleet-search-columns'
import * as roadTestPreDrive from './20261203-8101-road-test-pre-drive'

export const migrations = [
  { name: '20261201-0001-foundation', ...foundation },
  { name: '20261201-0002-audit-events', ...auditEvents },
  { name: '20261201-0003-profiles-and-reviews', ...profilesAndReviews },
  { name: '20261201-0004-road-tests-and-snags', ...roadTestsAndSnags },
  { name: '20261201-0006-road-test-files', ...roadTestFiles },
  { name: '20261201-0007-history', ...history },
  { name: '20261202-0008-revoked-sessions', ...revokedSessions },
  { name: '20261202-0009-platform-keys-per-workshop', ...platformKeys },
  { name: '20261203-2001-session-epoch', ...sessionEpoch },
  { name: '20261203-3001-history-form-2', ...historyForm2 },
  { name: '20261203-5001-kits', ...kits },
  { name: '20261203-5002-fleet-rechecks', ...fleetRechecks },
  { name: '20261203-5003-on-car-evaluations', ...onCarEvaluations },
  { name: '20261203-6001-road-test-idempotency', ...roadTestIdempotency },
  { name: '20261203-4001-drive-unit-roles', ...driveUnitRoles },
  { name: '20261203-4003-workshop-checks', ...workshopChecks },
  { name: '20261203-7101-fleet-search-columns', ...fleetSearchColumns },
  { name: '20261203-8101-road-test-pre-drive', ...roadTestPreDrive }
]
