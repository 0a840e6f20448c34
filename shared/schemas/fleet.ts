import type { Severity } from '../compute/types'

export const recheckReasons = ['thresholds', 'drive-unit', 'rules', 'asked'] as const
export type RecheckReason = typeof recheckReasons[number]
export const recheckReasonLabels: Record<RecheckReason, string> = {
  'thresholds': 'the workshop\'s safety thresholds changed',
  'drive-unit': 'a drive unit\'s settings changed',
  'rules': 'a new release of the safety rules',
  'asked': 'asked for by hand'
}

export interface RecheckWarning { rule: string, severity: Severity, message: string }

// A car whose settings on the car now raise warnings they did not raise at sign-off.
export interface RecheckCar {
  vehicleId: number
  stockRef: string
  make: string
  model: string
  year: number
  versionId: number
  versionNo: number
  profileName: string
  // Drift: the last read-back of the car's controller differed from what was signed off, since then.
  driftedAt: Date | string | null
  newWarnings: RecheckWarning[]
}

export interface RecheckView {
  id: number | null
  state: 'none' | 'running' | 'done' | 'superseded'
  reason: RecheckReason | null
  done: number
  total: number
  startedAt: string | null
  finishedAt: string | null
  cars: RecheckCar[]
}
