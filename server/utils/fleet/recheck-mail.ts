// One mail to each engineer per finished re-check, listing the cars that now raise new warnings.
import type { Transaction } from 'sequelize'
import { recheckReasonLabels, type RecheckReason } from '../../../shared/schemas/fleet'
import { absoluteUrl, peopleWithRole, queueMail } from '../mail/outbox'
import { worseCars } from './recheck-read'

const SHOWN = 50

export async function mailRecheckResult(t: Transaction, run: { id: number, workshopId: number, reason: string }) {
  const cars = await worseCars(run.id, SHOWN + 1, t)
  const engineers = await peopleWithRole(run.workshopId, 'engineer', t)
  const why = recheckReasonLabels[run.reason as RecheckReason] ?? run.reason
  const lines = cars.slice(0, SHOWN).map(c => `- ${c.stockRef} ${c.year} ${c.make} ${c.model} (${c.profileName} v${c.versionNo}): ${c.newWarnings.map(w => `${w.severity} — ${w.message}`).join('; ')}`)
  const text = [
    `Every car's settings were checked again because ${why}.`,
    cars.length ? `These cars now raise warnings they did not raise when their settings were signed off, worst first:` : 'No car raises a warning it did not raise when its settings were signed off.',
    ...lines,
    ...(cars.length > SHOWN ? ['… and more: see the Fleet screen.'] : []),
    '',
    'Look at each car with a qualified engineer before it is next driven, and follow local regulations.',
    `The Fleet screen: ${absoluteUrl('/fleet')}`,
    '',
    'Voltwright — tuning profile register'
  ].join('\n')
  const subject = cars.length ? `Fleet re-check: ${cars.length > SHOWN ? `over ${SHOWN}` : cars.length} car${cars.length === 1 ? '' : 's'} with new warnings` : 'Fleet re-check: no new warnings'
  await queueMail(t, engineers.map(e => ({ workshopId: run.workshopId, to: e.email, subject, text })))
}
