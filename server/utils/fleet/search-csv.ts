// Fleet search results as CSV: every cell quoted and formula-neutralised (server/utils/history/csv.ts).
import type { SignedIn } from '../guards/guards'
import { searchFields, UNIT_SETTING, type SearchRequest } from '../../../shared/schemas/fleet-search'
import { vehicleStatusLabels, type VehicleStatus } from '../../../shared/schemas/vehicle'
import { csvLine } from '../history/csv'
import { searchFleet } from './search'

const MAX_ROWS = 5000

function heading(key: string) {
  const f = searchFields.find(x => x.key === key)
  if (f) return f.unit ? `${f.label} (${f.unit})` : f.label
  const unit = UNIT_SETTING.exec(key)
  return unit ? `${unit[2]} on ${unit[1]}` : key
}

export async function searchCsv(user: SignedIn, q: SearchRequest): Promise<string> {
  const shown = [...new Set(q.conditions.map(c => c.field))].filter(f => f !== 'warning')
  const lines = [csvLine(['Stock ref', 'Year', 'Make', 'Model', 'Stage', 'Drive unit', 'Profile', 'Version on the car', ...shown.map(heading), 'Warnings raised'])]
  let cursor: string | undefined
  for (let rows = 0; rows < MAX_ROWS;) {
    const page = await searchFleet(user, { ...q, limit: 500, cursor })
    for (const i of page.items) {
      lines.push(csvLine([i.stockRef, String(i.year), i.make, i.model, vehicleStatusLabels[i.status as VehicleStatus] ?? i.status, i.driveUnit, i.profileName, String(i.versionNo),
        ...shown.map(f => (i.values[f] === null || i.values[f] === undefined ? '' : String(i.values[f]))), i.warnings.join('; ')]))
    }
    rows += page.items.length
    if (!page.nextCursor) break
    cursor = page.nextCursor
  }
  return lines.join('')
}
