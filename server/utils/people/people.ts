import { User } from '../../models'
import type { SignedIn } from '../guards/guards'
import type { UserCreate, UserUpdate } from '../../../shared/schemas/user'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'

export async function createPerson(admin: SignedIn, input: UserCreate) {
  if (await User.findOne({ where: { email: input.email } })) {
    throw createError({ statusCode: 409, message: 'Someone already signs in with this e-mail address.', data: { fields: [{ path: 'email', message: 'Already used' }] } })
  }
  const passwordHash = await hashPassword(input.password)
  return useDatabase().transaction(async (transaction) => {
    const user = await User.create({ workshopId: admin.workshopId, email: input.email, name: input.name, roles: input.roles, passwordHash }, { transaction })
    await appendAuditEvent(transaction, { workshopId: admin.workshopId, actorId: admin.id, action: 'user.created', entityType: 'user', entityId: user.id, data: { after: { email: user.email, name: user.name, roles: user.roles } } })
    return user.toPublic()
  })
}

export async function updatePerson(admin: SignedIn, id: number, input: UserUpdate) {
  if (id === admin.id && (input.active === false || (input.roles && !input.roles.includes('admin')))) {
    throw createError({ statusCode: 409, message: 'You cannot deactivate yourself or remove your own manager role; ask another manager.' })
  }
  const passwordHash = input.password ? await hashPassword(input.password) : undefined
  return useDatabase().transaction(async (transaction) => {
    const user = await User.findOne({ where: { id, workshopId: admin.workshopId }, transaction, lock: transaction.LOCK.UPDATE })
    if (!user) throw createError({ statusCode: 404, message: 'No such person in this workshop.' })
    const before = { name: user.name, roles: user.roles, active: user.active }
    const { password: _password, ...fields } = input
    // A new password or a deactivation ends every session this person has (docs/security.md).
    const endSessions = Boolean(passwordHash) || (before.active && input.active === false)
    await user.update({ ...fields, ...(passwordHash ? { passwordHash } : {}), ...(endSessions ? { sessionEpoch: user.sessionEpoch + 1 } : {}) }, { transaction })
    for (const change of personChanges(before, user, Boolean(passwordHash))) {
      await appendAuditEvent(transaction, { workshopId: admin.workshopId, actorId: admin.id, entityType: 'user', entityId: user.id, ...change })
    }
    return user.toPublic()
  })
}

type Person = { name: string, roles: string[], active: boolean }

// One history event per kind of change to a person (docs/history.md), each naming the person as they are
// after it; a rename carries the old name. The password itself never enters the history.
function personChanges(before: Person, after: Person, passwordChanged: boolean): { action: string, data: Record<string, unknown> }[] {
  const changes: { action: string, data: Record<string, unknown> }[] = []
  const replace = (key: keyof Person) => ({ patch: [{ op: 'replace', path: `/${key}`, value: after[key] }], before: { [key]: before[key] }, name: after.name })
  if (after.name !== before.name) changes.push({ action: 'user.renamed', data: replace('name') })
  if (JSON.stringify(after.roles) !== JSON.stringify(before.roles)) changes.push({ action: 'user.roles-changed', data: replace('roles') })
  if (after.active !== before.active) changes.push({ action: after.active ? 'user.reactivated' : 'user.deactivated', data: replace('active') })
  if (passwordChanged) changes.push({ action: 'user.password-changed', data: { name: after.name } })
  return changes
}
