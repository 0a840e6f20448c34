import { describe, it, expect, afterAll } from 'vitest'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl } from './helpers'
import { useRunningServer, signIn, withDatabase } from '../api/helpers'
import { approvedVersionOn } from '../api/road-test-fixtures'

const short = () => Math.random().toString(36).slice(2, 6)

// The admin's list of the workshop's own road-test checks, and which cars a check is asked on.
describe('the workshop\'s own checks, changed and limited to a drive unit', async () => {
  await useRunningServer()
  const admin = await signIn('admin@voltwright.test')
  const desk = await launch()
  const phone = await launch(390)
  afterAll(async () => { await desk.context.close(); await phone.context.close() })

  it('an admin changes a check: a wrong value is marked beside its field, and the change is saved and recorded', async () => {
    const made = (await admin.call('POST', '/api/workshop/checks', { label: `Cabin warms ${short()}`, record: 'number', unit: '°C', min: 15, max: 25 })).body
    try {
      const page = desk.page
      await signInThroughPage(page, 'admin@voltwright.test')
      await page.goto(`${baseUrl}/admin/checks`, { waitUntil: 'networkidle' })
      await page.getByRole('button', { name: `Change: ${made.label}` }).click()
      const form = page.getByRole('form', { name: `Change: ${made.label}` })
      expect(await form.getByLabel('Lowest expected').inputValue()).toBe('15')
      await form.getByLabel('Highest expected').fill('10')
      await form.getByRole('button', { name: 'Save the changes' }).click()
      await expect.poll(() => form.locator(`#edit-${made.key}-max-error`).textContent()).toContain('must be above the lowest')
      await form.getByLabel('Highest expected').fill('28')
      await form.getByLabel('What the tester checks').fill('')
      await form.getByRole('button', { name: 'Save the changes' }).click()
      await expect.poll(() => form.locator(`#edit-${made.key}-label-error`).textContent()).toContain('Say what is checked')
      expect(await form.locator(`#edit-${made.key}-max-error`).count()).toBe(0)
      expect(await accessibilityProblems(page)).toEqual([])
      await shot(page, 'workshop-checks-01-change-refused')

      await form.getByLabel('What the tester checks').fill('Cabin heater warms the car')
      await form.getByLabel('Every drive unit').uncheck()
      await form.getByLabel('Quennel 95').check()
      await form.getByRole('button', { name: 'Save the changes' }).click()
      const item = page.locator(`[data-check="${made.key}"]`)
      await expect.poll(() => item.textContent()).toContain('Cabin heater warms the car')
      expect(await item.textContent()).toMatch(/expected 15 to 28 · optional · Quennel 95/)
      expect(await form.count()).toBe(0)
      await shot(page, 'workshop-checks-02-changed')
      const listed = (await admin.call('GET', '/api/workshop/checks')).body.items.find((c: { key: string }) => c.key === made.key)
      expect(listed).toMatchObject({ label: 'Cabin heater warms the car', min: 15, max: 28, platformKeys: ['quennel-95'], retired: false })
      const events = await withDatabase(c => c.query(`SELECT data FROM audit_events WHERE action = 'workshop-check.changed' AND data->'after'->>'key' = $1`, [made.key]))
      expect(events.rows.map(r => [r.data.before.max, r.data.after.max])).toEqual([[25, 28]])
    } finally {
      await admin.call('PATCH', `/api/workshop/checks/${made.key}`, { retired: true })
    }
  })

  it('a check for one drive unit is asked on a car of that unit and not on a car of another', async () => {
    const everywhere = (await admin.call('POST', '/api/workshop/checks', { label: `Lamps all work ${short()}`, record: 'pass-fail' })).body
    const quennelOnly = (await admin.call('POST', '/api/workshop/checks', { label: `Hill hold lamp ${short()}`, record: 'pass-fail', platformKeys: ['quennel-95'] })).body
    try {
      const quennel = await approvedVersionOn('quennel-95', 'Unit Check Tourer')
      const marrick = await approvedVersionOn('marrick-110', 'Unit Check Saloon')
      const page = phone.page
      await signInThroughPage(page, 'tester@voltwright.test')
      const asked = async (versionId: number) => {
        await page.goto(`${baseUrl}/road-tests/new?version=${versionId}`, { waitUntil: 'networkidle' })
        await page.getByRole('button', { name: /^Workshop checks, step/ }).click()
        await expect.poll(() => page.getByRole('heading', { name: 'The workshop\'s own checks' }).count()).toBe(1)
        return page.locator('[data-extra-check] h3').allTextContents()
      }
      const onQuennel = await asked(quennel.versionId)
      expect(onQuennel.some(t => t.startsWith(quennelOnly.label))).toBe(true)
      expect(onQuennel.some(t => t.startsWith(everywhere.label))).toBe(true)
      await shot(page, 'workshop-checks-03-asked-on-its-unit')
      const onMarrick = await asked(marrick.versionId)
      expect(onMarrick.some(t => t.startsWith(everywhere.label))).toBe(true)
      expect(onMarrick.some(t => t.startsWith(quennelOnly.label))).toBe(false)
    } finally {
      for (const c of [everywhere, quennelOnly]) await admin.call('PATCH', `/api/workshop/checks/${c.key}`, { retired: true })
    }
  })
})
