import { describe, it, expect, afterAll } from 'vitest'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl } from './helpers'
import { recordConditions, recordHillStart, recordLiftOff } from './steps'
import { useRunningServer, signIn, withDatabase } from '../api/helpers'
import { approvedVersion, newCar, newProfile } from '../api/road-test-fixtures'

// One running server per file: both parts share it.
describe('any controller, and the workshop\'s own checks', async () => {
  await useRunningServer()
  const carId = await withDatabase(async c => (await c.query(`SELECT id FROM vehicles WHERE "stockRef" = 'OF-110'`)).rows[0].id as number)
  const { context, page } = await launch()
  afterAll(() => context.close())

  it('shows a switch, a choice and a curve with its chart, and says creep could not be checked', async () => {
    await signInThroughPage(page, 'tuner@voltwright.test')
    await page.goto(`${baseUrl}/cars/${carId}/try`, { waitUntil: 'networkidle' })
    const hillHold = page.getByRole('switch', { name: 'Hill hold' })
    await expect.poll(() => hillHold.getAttribute('aria-checked')).toBe('true')
    await hillHold.click()
    await expect.poll(() => hillHold.getAttribute('aria-checked')).toBe('false')
    await page.locator('label', { has: page.getByRole('radio', { name: 'Sport', exact: true }) }).click()
    expect(await page.getByRole('radio', { name: 'Sport', exact: true }).isChecked()).toBe(true)
    await expect.poll(() => page.locator('[data-chart="curve-throttleMap"] canvas').count()).toBe(1)
    await expect.poll(() => page.locator('[data-panel="warnings"] [data-rule="creep-hold"]').textContent()).toMatch(/Could not be checked: this controller has no creep setting/i)
    expect(await page.locator('[data-figure="creepHoldGradePct"]').textContent()).toContain('This controller has no creep setting')
    // A point below the one before breaks "never falls".
    await page.getByLabel('Point 3, Torque (%)').fill('5')
    await expect.poll(() => page.locator('[data-parameter="throttleMap"] .field-error').textContent()).toMatch(/must never fall: point 3 is below point 2/)
    await page.getByRole('button', { name: 'Add a point' }).click()
    expect(await page.getByLabel('Point 6, Pedal (%)').count()).toBe(1)
    await page.getByLabel('Point 6, Torque (%)').fill('')
    await expect.poll(() => page.locator('[data-parameter="throttleMap"] [data-curve-blank]').textContent()).toBe('Point 6 has no torque: fill it in or remove the point.')
    expect(await page.getByLabel('Point 6, Torque (%)').getAttribute('aria-invalid')).toBe('true')
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'any-controller-01-tune-sheet')
  })

  const tuner = await signIn('tuner@voltwright.test')
  const car = await newCar(tuner, { model: 'Checks Saloon' })
  await approvedVersion(await newProfile(car.id))
  const cleanup = await signIn('admin@voltwright.test')
  const admin = await launch()
  const phone = await launch(390)
  afterAll(async () => { await admin.context.close(); await phone.context.close() })

  it('an admin adds a check on the checks screen', async () => {
    const page = admin.page
    await signInThroughPage(page, 'admin@voltwright.test')
    await page.goto(`${baseUrl}/admin/checks`, { waitUntil: 'networkidle' })
    await page.getByLabel('What the tester checks').fill('Door mirrors adjust')
    await page.getByRole('button', { name: 'Add the check' }).click()
    await expect.poll(() => page.locator('[data-check]', { hasText: 'Door mirrors adjust' }).count()).toBe(1)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'any-controller-02-admin-checks')
  })

  it('the tester sees the workshop\'s checks after the drive checks, fails one and raises a snag in one tap', async () => {
    const page = phone.page
    await signInThroughPage(page, 'tester@voltwright.test')
    await page.getByRole('link', { name: /Start the road test of Testwick Checks Saloon/ }).first().click()
    await recordConditions(page, { surface: 'Dry', ambientC: '12', route: 'Forge loop' })
    await recordHillStart(page, '12', '20')
    await recordLiftOff(page, 'gentle')
    for (let i = 0; i < 4; i++) {
      await page.getByRole('button', { name: 'Next check' }).click()
      if (i === 3) {
        await page.getByLabel(/Peak motor/).fill('70')
        await page.getByLabel(/Peak inverter/).fill('55')
        await page.getByLabel(/Peak battery/).fill('30')
      }
      await page.locator('label', { has: page.getByRole('radio', { name: 'Pass', exact: true }) }).click()
    }
    await page.getByRole('button', { name: 'To the workshop\'s checks' }).click()
    await expect.poll(() => page.getByRole('heading', { name: 'Door mirrors adjust' }).count()).toBe(1)
    const mirrors = page.locator('[data-extra-check]', { hasText: 'Door mirrors adjust' })
    await mirrors.locator('label', { has: page.getByRole('radio', { name: 'Fail', exact: true }) }).click()
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'any-controller-03-workshop-checks-phone')
    await page.getByRole('button', { name: 'To the verdict' }).click()
    await page.locator('label', { has: page.getByRole('radio', { name: 'Fail', exact: true }) }).click()
    await page.getByRole('button', { name: 'Save the road test' }).click()
    await page.waitForURL(u => /^\/road-tests\/\d+$/.test(u.pathname))
    const item = page.locator('li', { hasText: 'Door mirrors adjust' }).first()
    await item.getByRole('button', { name: 'Remedial work on the car' }).click()
    await expect.poll(() => item.getByText('Snag raised').count()).toBe(1)
    const snags = await withDatabase(c => c.query(`SELECT kind, title FROM snags WHERE "vehicleId" = $1`, [car.id]))
    expect(snags.rows).toEqual([{ kind: 'remedial', title: expect.stringContaining('Door mirrors adjust failed') }])
    await shot(page, 'any-controller-04-snag-raised')
    const checks = await withDatabase(c => c.query(`SELECT key FROM workshop_checks WHERE label = 'Door mirrors adjust'`))
    for (const r of checks.rows) await cleanup.call('PATCH', `/api/workshop/checks/${r.key}`, { retired: true })
  })

})
