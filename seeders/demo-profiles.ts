// The demo workshop's tuning profiles, consistent with each car's stage; all of it invented for the demo.
import type { VersionState } from '../shared/schemas/version'

export interface DemoReview { by: string, decision: 'approve' | 'reject', comment: string }
export interface DemoVersion {
  author: string
  parameters: Record<string, number>
  rationale: string
  state: VersionState
  justifications?: Record<string, string>
  review?: DemoReview
  daysAgo: number
}
export interface DemoProfile { stockRef: string, name: string, versions: DemoVersion[], onCarVersionNo?: number }

const tuner = 'tuner@voltwright.test'
const engineer = 'engineer@voltwright.test'
const lead = 'lead@voltwright.test'

export const demoProfiles: DemoProfile[] = [
  {
    stockRef: 'OF-101', name: 'Road',
    versions: [
      {
        author: tuner, daysAgo: 9, state: 'rejected',
        parameters: { powerCapKw: 45, torqueCapNm: 160, regenTorqueLimitNm: 120, liftOffRegenPct: 60 },
        rationale: 'Owner asked for a strong one-pedal feel in town; full torque for the hill out of the village.',
        justifications: { 'regen-grip-snow': 'Owner says the car is not used in winter.' },
        review: { by: engineer, decision: 'reject', comment: 'Lift-off regen at 60 % of 120 N·m brakes the rear axle alone at about 1.6 m/s²: beyond its grip on snow and it lights the stop lamps on every lift. "Not used in winter" is not enough on a rear-driven roadster. Bring lift-off down to about 25 % of 80 N·m and take the power cap to 42 kW.' }
      },
      {
        author: tuner, daysAgo: 6, state: 'approved',
        parameters: { powerCapKw: 42, torqueCapNm: 150, regenTorqueLimitNm: 80, liftOffRegenPct: 25, speedLimitKph: 120 },
        rationale: 'As sent back: lift-off regen 25 % of 80 N·m (about 0.5 m/s²), power cap 42 kW, speed limit 120 km/h for the original drum brakes.',
        review: { by: engineer, decision: 'approve', comment: 'Lift-off now well inside the rear grip in the wet. Road test on the wet loop as well as the dry one, please.' }
      }
    ]
  },
  {
    stockRef: 'OF-102', name: 'Road',
    versions: [{
      author: tuner, daysAgo: 1, state: 'draft',
      parameters: { powerCapKw: 75, torqueCapNm: 240, liftOffRegenPct: 20 },
      rationale: 'First cut for the estate: a little over the original engine\'s power (about 1.1 times), gentle lift-off regen while the pack is being fitted.'
    }]
  },
  {
    stockRef: 'OF-103', name: 'Road', onCarVersionNo: 1,
    versions: [{
      author: tuner, daysAgo: 60, state: 'signed-off',
      parameters: { powerCapKw: 30, torqueCapNm: 120, speedLimitKph: 110, batteryDischargeLimitA: 150 },
      rationale: 'Power cap 30 kW, about 1.2 times the original engine, within what the small drum brakes and 12-inch tyres take.',
      review: { by: engineer, decision: 'approve', comment: 'Sensible for a front-driven car of this weight.' }
    }]
  },
  {
    stockRef: 'OF-103', name: 'Valet', onCarVersionNo: 1,
    versions: [{
      author: tuner, daysAgo: 58, state: 'signed-off',
      parameters: { powerCapKw: 15, torqueCapNm: 80, speedLimitKph: 50, liftOffRegenPct: 10 },
      rationale: 'For parking attendants and the owner\'s family: 15 kW, 50 km/h, light regen.',
      review: { by: lead, decision: 'approve', comment: '' }
    }]
  },
  {
    stockRef: 'OF-104', name: 'Road', onCarVersionNo: 1,
    versions: [
      {
        author: tuner, daysAgo: 20, state: 'signed-off',
        parameters: { powerCapKw: 95, torqueCapNm: 250, liftOffRegenPct: 25, speedLimitKph: 170 },
        rationale: 'Coupé with uprated front discs: 95 kW, 1.1 times the original engine; speed limit kept below the tyres\' rating.',
        review: { by: engineer, decision: 'approve', comment: 'Approved; watch the inverter temperature on the full-power pull.' }
      },
      {
        author: lead, daysAgo: 1, state: 'in-review',
        parameters: { powerCapKw: 95, torqueCapNm: 250, liftOffRegenPct: 15, speedLimitKph: 170 },
        rationale: 'The tester found lift-off regen abrupt on the wet roundabout; 15 % instead of 25 %.'
      }
    ]
  },
  {
    stockRef: 'OF-106', name: 'Road',
    versions: [{
      author: tuner, daysAgo: 3, state: 'in-review',
      parameters: { powerCapKw: 45, torqueCapNm: 160, regenTorqueLimitNm: 110, liftOffRegenPct: 35 },
      rationale: 'Full Fenlow power; firmer lift-off regen to recover energy on the owner\'s hilly commute.',
      justifications: { 'regen-grip-snow': 'The owner lays the car up from November to March; the handover sheet will say it must not be driven on snow. Lift-off is well inside the wet grip.' }
    }]
  }
]
