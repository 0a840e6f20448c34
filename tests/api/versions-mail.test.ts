import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, baseUrl, withDatabase } from './helpers'
import { newCar, newProfile } from './version-fixtures'

// maildev's REST API: GET /api/email lists what the SMTP sink received.
const mailApi = process.env.VOLTWRIGHT_MAIL_API ?? 'http://127.0.0.1:1090'
interface SunkMail { subject: string, text: string, html: string, to: { address: string }[] }

async function mailAbout(versionId: number, subjectStart: string, recipients: number): Promise<SunkMail[]> {
  const link = `${baseUrl}/versions/${versionId}`
  let found: SunkMail[] = []
  await expect.poll(async () => {
    const all = await (await fetch(`${mailApi}/api/email`)).json() as SunkMail[]
    found = all.filter(m => m.subject.startsWith(subjectStart) && m.text.includes(`${link}\n`))
    return found.length
  }, { timeout: 15000, interval: 500 }).toBe(recipients)
  return found
}

// Whoever holds the engineer role in the demo workshop now, but the author.
async function engineersBut(authorEmail: string): Promise<string[]> {
  const rows = await withDatabase(c => c.query(`SELECT u.email FROM users u JOIN users a ON a.email = $1
    WHERE u."workshopId" = a."workshopId" AND u.active AND 'engineer' = ANY(u.roles) AND u.id <> a.id ORDER BY u.email`, [authorEmail]))
  return rows.rows.map(r => r.email)
}

describe('mail about reviews, through the outbox to the SMTP sink', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const engineer = await signIn('engineer@voltwright.test')
  const lead = await signIn('lead@voltwright.test')
  const car = await newCar(tuner)

  it('tells every engineer but the author that a review is wanted, with the car, the version and its link', async () => {
    const v = await newProfile(lead, car.id, { name: 'Road' })
    expect((await lead.call('POST', `/api/versions/${v.id}/submit`, {})).status).toBe(200)
    const expected = await engineersBut('lead@voltwright.test')
    expect(expected).toContain('engineer@voltwright.test')
    expect(expected).not.toContain('lead@voltwright.test')
    const mails = await mailAbout(v.id, 'Review wanted', expected.length)
    // lead@ wrote it, so the other engineers hear and lead@ does not.
    expect(mails.map(m => m.to[0]!.address).sort()).toEqual(expected)
    expect(mails[0]!.subject).toBe(`Review wanted: ${car.stockRef} Testwick Review Saloon — Road v1`)
    expect(mails[0]!.text).toContain('Ravi Ostrander has sent version 1 of the Road profile')
    expect(mails[0]!.html).toContain(`href="${baseUrl}/versions/${v.id}"`)
  })

  it('tells the author when a version is approved, and when it is sent back with the comment', async () => {
    const approved = await newProfile(tuner, car.id, { name: 'Valet' })
    await tuner.call('POST', `/api/versions/${approved.id}/submit`, {})
    const expected = await engineersBut('tuner@voltwright.test')
    expect(expected).toEqual(expect.arrayContaining(['engineer@voltwright.test', 'lead@voltwright.test']))
    const submitted = await mailAbout(approved.id, 'Review wanted', expected.length)
    expect(submitted.map(m => m.to[0]!.address).sort()).toEqual(expected)
    await engineer.call('POST', `/api/versions/${approved.id}/approve`, { comment: 'Good for the valet key.' })
    const [yes] = await mailAbout(approved.id, 'Approved', 1)
    expect(yes!.to.map(t => t.address)).toEqual(['tuner@voltwright.test'])
    expect(yes!.subject).toBe(`Approved: ${car.stockRef} Testwick Review Saloon — Valet v1`)
    expect(yes!.text).toContain('Maud Ellery has approved version 1')
    expect(yes!.text).toContain('Comment: Good for the valet key.')

    const sentBack = (await tuner.call('POST', `/api/profiles/${approved.profileId}/versions`, { fromVersionId: approved.id })).body
    await tuner.call('POST', `/api/versions/${sentBack.id}/submit`, {})
    await lead.call('POST', `/api/versions/${sentBack.id}/reject`, { comment: 'Speed limit <b>too high</b> for valets.' })
    const [no] = await mailAbout(sentBack.id, 'Sent back', 1)
    expect(no!.to.map(t => t.address)).toEqual(['tuner@voltwright.test'])
    expect(no!.subject).toBe(`Sent back: ${car.stockRef} Testwick Review Saloon — Valet v2`)
    expect(no!.text).toContain('Comment: Speed limit <b>too high</b> for valets.')
    // The comment is the reviewer's text, never markup in the HTML part.
    expect(no!.html).toContain('Speed limit &lt;b&gt;too high&lt;/b&gt; for valets.')
  })
})
