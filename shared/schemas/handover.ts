// The handover sheet's content, the same for the screen and the PDF.
import type { Severity } from '../compute/types'

export interface HandoverLine { label: string, value: string, note?: string }
export interface HandoverWarning { rule: string, severity: Severity, message: string, justification: string | null }
export interface HandoverPerson { role: string, name: string, at: string | null, hash: string | null, hashLabel: string }

export interface HandoverProfile {
  profileName: string
  versionNo: number
  versionId: number
  signedOffAt: string | null
  settings: HandoverLine[]
  figures: HandoverLine[]
  warnings: HandoverWarning[]
  roadTest: {
    id: number, testedAt: string, tester: string, verdict: 'pass' | 'fail', conditions: string
    checks: { label: string, verdict: string, measured: string, note: string }[]
    log: HandoverLine[]
  } | null
  people: HandoverPerson[]
}

export interface OpenWork { title: string, kind: string, priority: string }

export interface HandoverSheet {
  workshop: string
  generatedAt: string
  car: { id: number, title: string, stockRef: string, registration: string, chassisNumber: string, owner: string | null, driveUnit: string, status: string }
  carFacts: HandoverLine[]
  profiles: HandoverProfile[]
  enhancements: { title: string, detail: string, priority: string }[]
  openWork: OpenWork[] // faults and repairs the workshop has not finished: the owner is told of them
  openWorkAdvice: string
  cautions: string[]
  notice: string | null // the controller was found drifted: said before anything else
}

// Which wheels regen brakes, in the owner's words, by the car's driven axle.
const regenAxle: Record<'front' | 'rear' | 'all', string> = {
  front: 'On this front-driven car it brakes the front wheels alone: on wet, icy or loose roads, lift off gently, allow more distance, and expect the steering to feel lighter as it slows.',
  rear: 'On this rear-driven car it brakes the rear wheels alone, which can make the back of the car step out: on wet, icy or loose roads, lift off gently and allow more distance.',
  all: 'On this car it brakes all four wheels through the drive: on wet, icy or loose roads, lift off gently and allow more distance.'
}

export function handoverCautions(drivenAxle: 'front' | 'rear' | 'all'): string[] {
  return HANDOVER_CAUTIONS.map(c => c.startsWith('Regenerative braking') ? `Regenerative braking slows the car when you lift off the accelerator. ${regenAxle[drivenAxle]}` : c)
}

// Put at the top of the sheet when a read-back last found the controller holding other settings (drift).
export function driftNotice(foundOn: string): string {
  return `On ${foundOn} the controller was found holding settings other than those on this sheet. Until the workshop has put the signed-off settings back and read them back, do not rely on this sheet: the car may pull, slow and hold differently, and should not be driven before a qualified engineer has checked it.`
}

export const HANDOVER_CAUTIONS = [
  'These controller settings were proposed, reviewed by a senior engineer who did not write them, and proved on a road test on the date shown. They suit this car as it was when tested: a change of tyres, brakes, suspension, battery or load can make them unsuitable.',
  'Regenerative braking slows the car when you lift off the accelerator. On a rear-driven car it brakes the rear wheels alone: on wet, icy or loose roads, lift off gently and allow more distance.',
  'The car must meet the rules that apply where it is driven (registration, type or individual approval, periodic inspection, insurance). Tell your insurer about the conversion. Where this sheet and local regulations differ, the regulations apply.',
  'Do not change the controller settings yourself. Any change should be made, reviewed and road-tested by a qualified engineer, and recorded as a new version on the register.',
  'Have the brakes, tyres and high-voltage system inspected at the intervals your workshop recommends, and straight away after any warning light, fault or collision.'
]

// What the owner is told of faults and repairs still open on the car, by the most pressing one's priority;
// before handover the car is still with the workshop, which finishes them first.
export function openWorkAdvice(priorities: string[], beforeHandover = false): string {
  if (!priorities.length) return 'None: the workshop has no fault or repair open on this car.'
  if (beforeHandover) return 'The workshop deals with these before it hands the car over, or agrees them with you first.'
  if (priorities.includes('urgent')) return 'At least one of these is urgent: do not drive the car until the workshop tells you it has been put right.'
  if (priorities.includes('high')) return 'Ask the workshop whether the car may be driven before these are done.'
  return 'The workshop will arrange these with you.'
}
