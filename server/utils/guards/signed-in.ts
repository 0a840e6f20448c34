import type { H3Event } from 'h3'
import { isStaff, type Role } from '../../../shared/schemas/roles'
import { selectRows } from '../database/db'
import type { SignedIn } from './guards'

// A route's own read, written for a person: the SQL, its values, and how its rows are ordered (on `r`).
// The read may depend on the person's id, workshop and whether they are staff, nothing else.
export interface ReadFor { sql: string, replacements: Record<string, unknown>, orderBy?: string }

type Row = Record<string, unknown>
const ME = `SELECT id AS "me:id", "workshopId" AS "me:workshopId", email AS "me:email", name AS "me:name", roles AS "me:roles",
    active AS "me:active", "sessionEpoch" AS "me:sessionEpoch",
    EXISTS (SELECT 1 FROM revoked_sessions WHERE "sessionId" = :meSessionId) AS "me:revoked"
  FROM users WHERE id = :meId`

const pleaseSignIn = () => createError({ statusCode: 401, message: 'Please sign in.' })

// Refuses a request whose cookie names nobody, before its body is read; the person is checked later.
export async function requireSessionCookie(event: H3Event): Promise<void> {
  if (!event.context.signedIn && typeof (await getUserSession(event)).user?.id !== 'number') throw pleaseSignIn()
}

// The session says who signed in; the database says whether they still may: deactivation, a password change
// (both raise the person's session epoch) and signing out take effect at once, for every copy of the cookie.
// That check is one plain query on every request, and a route's own read rides in the same round trip
// (docs/architecture.md, "Speed"): the read runs for the person as the sealed cookie names them, and runs
// again on its own only if the database now puts them in another workshop or another kind of role.
export async function signedInRead<T extends object = Row>(event: H3Event, read?: (user: SignedIn) => ReadFor): Promise<{ user: SignedIn, rows: T[] }> {
  const known = event.context.signedIn as SignedIn | undefined
  if (known) return { user: known, rows: read ? await readRows<T>(read(known)) : [] }
  const session = await getUserSession(event)
  const named = session.user as Partial<SignedIn> | undefined
  if (typeof named?.id !== 'number') throw pleaseSignIn()
  const guess = read && typeof named.workshopId === 'number' && Array.isArray(named.roles) ? read(named as SignedIn) : null
  if (guess && ('meId' in guess.replacements || 'meSessionId' in guess.replacements)) throw new Error(':meId and :meSessionId belong to the sign-in check')
  const all = await selectRows<Row>(guess
    ? `SELECT r.*, me.* FROM (${ME}) me LEFT JOIN LATERAL (SELECT true AS "me:found", x.* FROM (${guess.sql}) x) r ON true${guess.orderBy ? ` ORDER BY ${guess.orderBy}` : ''}`
    : ME, { ...guess?.replacements, meId: named.id, meSessionId: session.id ?? '' })
  const me = all[0]
  if (!me || !me['me:active'] || me['me:revoked'] || me['me:sessionEpoch'] !== (session.secure?.sessionEpoch ?? 0)) {
    await clearUserSession(event)
    throw pleaseSignIn()
  }
  const user: SignedIn = { id: me['me:id'] as number, workshopId: me['me:workshopId'] as number, email: me['me:email'] as string, name: me['me:name'] as string, roles: me['me:roles'] as Role[] }
  event.context.signedIn = user
  if (!read) return { user, rows: [] }
  const same = guess && user.workshopId === named.workshopId && isStaff(user.roles) === isStaff(named.roles!)
  return { user, rows: same ? all.filter(r => r['me:found']).map(ownColumns) as T[] : await readRows<T>(read(user)) }
}

const readRows = <T>(q: ReadFor) => selectRows<T>(q.sql, q.replacements)

function ownColumns(row: Row): Row {
  const own: Row = {}
  for (const k in row) if (!k.startsWith('me:')) own[k] = row[k]
  return own
}
