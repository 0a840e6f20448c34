import type { Transaction } from 'sequelize'
import type { Profile, ProfileVersion, User } from '../../models'
import type { SignedIn } from '../guards/guards'
import { queueMail, peopleWithRole, absoluteUrl } from '../mail/outbox'
import type { VersionSubject } from './views'

interface About { version: ProfileVersion, profile: Profile, subject: VersionSubject }

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, c => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', '\'': '&#39;' })[c]!)

function message(workshopId: number, to: string, subject: string, lines: string[], link: string) {
  const text = [...lines, '', `Open the version: ${link}`, '', 'Voltwright — tuning profile register'].join('\n')
  const html = `${lines.map(l => `<p>${escapeHtml(l)}</p>`).join('')}<p><a href="${escapeHtml(link)}">Open the version</a></p><p style="color:#6b675f">Voltwright — tuning profile register</p>`
  return { workshopId, to, subject, text, html }
}

const title = ({ version, profile, subject }: About) => `${subject.shortName} — ${profile.name} v${version.versionNo}`
const link = (about: About) => absoluteUrl(`/versions/${about.version.id}`)

// Submitted: every engineer of the workshop but the author hears that a review is wanted.
export async function mailReviewWanted(t: Transaction, author: SignedIn, about: About, dangerCount: number) {
  const engineers = (await peopleWithRole(author.workshopId, 'engineer', t)).filter(p => p.id !== author.id)
  const dangers = dangerCount === 0 ? 'No danger warnings.' : `${dangerCount} danger warning${dangerCount === 1 ? '' : 's'}, each with the author's written justification.`
  await queueMail(t, engineers.map(e => message(author.workshopId, e.email, `Review wanted: ${title(about)}`, [
    `${author.name} has sent version ${about.version.versionNo} of the ${about.profile.name} profile for ${about.subject.name} for review.`,
    ...(about.version.origin === 'roadside' ? [`The settings were changed at the roadside during road test ${about.version.roadTestId}. Why: ${about.version.rationale}`] : []),
    dangers,
    'Another engineer than the author must approve it before it is road-tested.'
  ], link(about))))
}

// Approved or sent back: the author hears the decision and the reviewer's comment.
export async function mailDecision(t: Transaction, reviewer: SignedIn, author: User | null, about: About, decision: 'approve' | 'reject', comment: string) {
  if (!author || !author.active) return
  const approved = decision === 'approve'
  await queueMail(t, message(reviewer.workshopId, author.email, `${approved ? 'Approved' : 'Sent back'}: ${title(about)}`, [
    approved
      ? `${reviewer.name} has approved version ${about.version.versionNo} of the ${about.profile.name} profile for ${about.subject.name}.${about.subject.vehicleId ? ' It now awaits its road test.' : ' Cars booked in from the kit now start from it.'}`
      : `${reviewer.name} has sent back version ${about.version.versionNo} of the ${about.profile.name} profile for ${about.subject.name}.`,
    ...(comment ? [`Comment: ${comment}`] : [])
  ], link(about)))
}
