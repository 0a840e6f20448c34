// Demo data, in order; run once each (the seed_runs table remembers), so running again changes nothing.
import * as demoWorkshop from './20261201-0001-demo-workshop'
import * as demoProfiles from './20261201-0002-demo-profiles'
import * as demoRoadTests from './20261201-0003-demo-road-tests'
import * as demoReadbacks from './20261201-0004-demo-readbacks'
import * as demoKits from './20261203-5001-demo-kits'
import * as demoOnCar from './20261203-5002-demo-on-car-evaluations'
import * as moreDriveUnits from './20261203-4002-more-drive-units'
import * as demoRoadTestChecks from './20261203-4004-demo-road-test-checks'

export const seeders = [
  { name: '20261201-0001-demo-workshop', ...demoWorkshop },
  { name: '20261201-0002-demo-profiles', ...demoProfiles },
  { name: '20261201-0003-demo-road-tests', ...demoRoadTests },
  { name: '20261201-0004-demo-readbacks', ...demoReadbacks },
  { name: '20261203-5001-demo-kits', ...demoKits },
  { name: '20261203-5002-demo-on-car-evaluations', ...demoOnCar },
  { name: '20261203-4002-more-drive-units', ...moreDriveUnits },
  { name: '20261203-4004-demo-road-test-checks', ...demoRoadTestChecks }
]
