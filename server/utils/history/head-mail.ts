import type { H3Event } from 'h3'
import { QueryTypes, type Transaction } from 'sequelize'
import type { SignedIn } from '../guards/guards'
import { absoluteUrl, peopleWithRole, queueMail } from '../mail/outbox'
import { useDatabase } from '../database/db'

interface Head { workshopId: number, workshopName: string, headId: string | null, headHash: string | null }

function headMailText(h: Head, day: string | null): string {
  if (!h.headId) return `${h.workshopName}'s history holds no events yet${day ? ` (${day})` : ''}.\n`
  return [
    `The newest event of ${h.workshopName}'s history${day ? ` at the start of ${day} (UTC)` : ' as of now'}:`,
    '', `  event ${h.headId}`, `  hash  ${h.headHash}`, '',
    'Keep this mail where the workshop cannot reach it. Removing the newest events leaves a history that still',
    'checks out on its own; only a head noted earlier shows it. To check that this event is still in the history',
    'unchanged, paste this line into "Check the chain" on the auditor\'s bench:', '', `  ${h.headId}:${h.headHash}`, '',
    'or, signed in as an auditor, open', `  ${absoluteUrl('/api/audit/verify')}?head=${h.headId}:${h.headHash}`, ''
  ].join('\n')
}

async function mailHead(t: Transaction, h: Head, day: string | null, extra: string[] = [], toAuditors = true): Promise<number> {
  const auditors = toAuditors ? (await peopleWithRole(h.workshopId, 'auditor', t)).map(p => p.email) : []
  const to = [...new Set([...auditors, ...extra])]
  const subject = day ? `History head of ${h.workshopName}, ${day}` : `History head of ${h.workshopName}, on request`
  await queueMail(t, to.map(address => ({ workshopId: h.workshopId, to: address, subject, text: headMailText(h, day) })))
  return to.length
}

const HEAD_SQL = `SELECT w.id AS "workshopId", w.name AS "workshopName", h.id AS "headId", h.hash AS "headHash" FROM workshops w
  LEFT JOIN LATERAL (SELECT id, hash FROM audit_events WHERE "workshopId" = w.id ORDER BY id DESC LIMIT 1) h ON true`

// On request a person may send ON_REQUEST_LIMIT mails in ON_REQUEST_WINDOW_MIN minutes, so nobody can flood the
// auditors' inboxes; counted from the outbox (the asker always gets a copy), one request at a time per workshop.
export const ON_REQUEST_LIMIT = 3
const ON_REQUEST_WINDOW_MIN = 10

async function requireOnRequestAllowance(event: H3Event, t: Transaction, user: SignedIn) {
  await useDatabase().query('SELECT pg_advisory_xact_lock(hashtext(\'head-mail\'), :w)', { replacements: { w: user.workshopId }, transaction: t })
  const [row] = await useDatabase().query<{ n: number, oldest: Date | null }>(
    `SELECT count(*)::int AS n, min("createdAt") AS oldest FROM mail_outbox
      WHERE "workshopId" = :w AND "to" = :email AND subject LIKE '% on request' AND "createdAt" > now() - make_interval(mins => :window)`,
    { replacements: { w: user.workshopId, email: user.email, window: ON_REQUEST_WINDOW_MIN }, type: QueryTypes.SELECT, transaction: t })
  if (row!.n < ON_REQUEST_LIMIT) return
  const wait = Math.max(1, Math.ceil((new Date(row!.oldest!).getTime() + ON_REQUEST_WINDOW_MIN * 60_000 - Date.now()) / 1000))
  setResponseHeader(event, 'Retry-After', wait)
  throw createError({ statusCode: 429, message: `At most ${ON_REQUEST_LIMIT} history-head mails on request every ${ON_REQUEST_WINDOW_MIN} minutes: the next can go in ${Math.ceil(wait / 60)} min.` })
}

// On request: the head now, to the workshop's auditors and to whoever asked, or to the asker only.
export async function mailHeadNow(event: H3Event, user: SignedIn, to: 'auditors' | 'me') {
  return useDatabase().transaction(async (t) => {
    await requireOnRequestAllowance(event, t, user)
    const [h] = await useDatabase().query<Head>(`${HEAD_SQL} WHERE w.id = :w`, { replacements: { w: user.workshopId }, type: QueryTypes.SELECT, transaction: t })
    const sentTo = await mailHead(t, h!, null, [user.email], to === 'auditors')
    return { head: h!.headId ? { id: String(h!.headId), hash: h!.headHash! } : null, sentTo }
  })
}

// Each day's mail, claimed per workshop in PostgreSQL: the primary key (workshop, day) lets one instance's
// INSERT through and makes every other one (and every later tick) a no-op, and the mail is queued in the
// same transaction, so the day's mail goes once, however many instances ask and however often.
export async function sendDailyHeadMails(now = new Date()): Promise<number> {
  const day = now.toISOString().slice(0, 10)
  return useDatabase().transaction(async (t) => {
    const claimed = await useDatabase().query<Head>(
      `WITH heads AS (${HEAD_SQL} WHERE NOT EXISTS (SELECT 1 FROM audit_head_mails m WHERE m."workshopId" = w.id AND m.day = :day)),
       claimed AS (INSERT INTO audit_head_mails ("workshopId", day, "headId", "headHash", "sentAt")
         SELECT "workshopId", :day, "headId", "headHash", now() FROM heads ON CONFLICT DO NOTHING RETURNING "workshopId")
       SELECT heads.* FROM heads JOIN claimed USING ("workshopId")`,
      { replacements: { day }, type: QueryTypes.SELECT, transaction: t })
    for (const h of claimed) await mailHead(t, h, day)
    return claimed.length
  })
}
