// Fleet search results as CSV: every cell quoted and formula-neutralised (server/utils/history/csv.ts).
import type { SignedIn } from '../guards/guards'
import { resultFields, searchFields, type SearchRequest } from '../../../shared/schemas/fleet-search'
import { ruleTitles } from '../../../shared/compute/rule-titles'
import type { RuleId } from '../../../shared/compute/types'
import { vehicleStatusLabels, type VehicleStatus } from '../../../shared/schemas/vehicle'
import { formatDate } from '../../../shared/utils/dates'
import { csvLine } from '../history/csv'
import { searchFleet } from './search'
import { unitSettingsOf, type UnitSetting } from './search-units'

const MAX_ROWS = 5000

function heading(key: string, units: Map<string, UnitSetting>) {
  const f = searchFields.find(x => x.key === key)
  if (f) return f.unit ? `${f.label} (${f.unit})` : f.label
  const u = units.get(key)!
  return `${u.label} on the ${u.unitName}${u.unit ? ` (${u.unit})` : ''}`
}

// A value as the screen words it: a choice by its label, a number as it is.
function cell(key: string, v: number | string | null | undefined) {
  if (v === null || v === undefined) return ''
  return searchFields.find(x => x.key === key)?.choices?.find(c => c.value === v)?.label ?? String(v)
}

export async function searchCsv(user: SignedIn, q: SearchRequest): Promise<string> {
  const shown = resultFields(q.conditions)
  const units = await unitSettingsOf(user, shown)
  const lines = [csvLine(['Stock ref', 'Year', 'Make', 'Model', 'Stage', 'Drive unit', 'Profile', 'Version signed off onto the car', 'Last read-back', ...shown.map(f => heading(f, units)), 'Warnings raised'])]
  let cursor: string | undefined
  for (let rows = 0; rows < MAX_ROWS;) {
    const page = await searchFleet(user, { ...q, limit: 500, cursor })
    for (const i of page.items) {
      lines.push(csvLine([i.stockRef, String(i.year), i.make, i.model, vehicleStatusLabels[i.status as VehicleStatus] ?? i.status, i.driveUnit, i.profileName, String(i.versionNo), i.driftedAt ? `Differed from it (drift since ${formatDate(i.driftedAt, { timeZone: 'UTC' })})` : '',
        ...shown.map(f => cell(f, i.values[f])), i.warnings.map(w => ruleTitles[w as RuleId]?.title ?? w).join('; ')]))
    }
    rows += page.items.length
    if (!page.nextCursor) break
    cursor = page.nextCursor
  }
  return lines.join('')
}
