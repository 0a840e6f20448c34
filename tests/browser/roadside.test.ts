import { describe, it, expect, afterAll } from 'vitest'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl } from './helpers'
import { useRunningServer, signIn } from '../api/helpers'
import { approvedVersion, approvedVersionOn, newCar, newProfile, recordRoadTest } from '../api/road-test-fixtures'

// A roadside change on a phone: the live warnings, and a written reason for each danger before it is sent.
describe('a tester records a roadside change that needs a justification', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const car = await newCar(tuner, { model: 'Roadside Saloon' })
  const versionId = await approvedVersion(await newProfile(car.id))
  const roadTestId = await recordRoadTest(tester, versionId)
  const { context, page } = await launch(390)
  afterAll(() => context.close())

  it('shows the danger as the settings are typed and refuses to send it without a reason', async () => {
    await signInThroughPage(page, 'tester@voltwright.test')
    await page.goto(`${baseUrl}/road-tests/${roadTestId}`, { waitUntil: 'networkidle' })
    await page.locator('summary', { hasText: 'Changed settings at the roadside' }).click()
    await page.locator('#roadside-regenTorqueLimitNm').fill('200')
    await page.locator('#roadside-liftOffRegenPct').fill('90')
    await page.locator('#roadside-rationale').fill('Lift-off regen raised for the long descent')
    await expect.poll(() => page.locator('[data-danger-rule]').count()).toBeGreaterThan(0)
    await page.getByRole('button', { name: 'Send version for review' }).click()
    await expect.poll(() => page.getByText('Say why this is acceptable on this car').count()).toBeGreaterThan(0)
    expect((await tester.call('GET', `/api/road-tests/${roadTestId}`)).body.roadsideVersions).toEqual([])
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'roadside-01-needs-reasons')
  })

  it('sends it with a reason per danger, and the reviewer reads them', async () => {
    const boxes = await page.locator('textarea[id^="roadside-justify-"]').all()
    for (const box of boxes) await box.fill('Only for the dry descent on the test route; back to the approved value afterwards.')
    await page.getByRole('button', { name: 'Send version for review' }).click()
    await expect.poll(() => page.getByText(/sent for review; the engineers have been asked/).count()).toBe(1)
    const [created] = (await tester.call('GET', `/api/road-tests/${roadTestId}`)).body.roadsideVersions
    const version = (await tester.call('GET', `/api/versions/${created.id}`)).body
    expect(version.state).toBe('in-review')
    expect(Object.keys(version.justifications)).toHaveLength(boxes.length)
    await shot(page, 'roadside-02-sent')
  })

  it('on a drive unit with a switch, modes and a curve, offers each as the tune sheet does and sends them', async () => {
    const quennel = await approvedVersionOn('quennel-95', 'Roadside Tourer')
    const quennelTest = await recordRoadTest(tester, quennel.versionId)
    await page.goto(`${baseUrl}/road-tests/${quennelTest}`, { waitUntil: 'networkidle' })
    await page.locator('summary', { hasText: 'Changed settings at the roadside' }).click()
    const hillHold = page.getByRole('switch', { name: 'Hill hold' })
    await expect.poll(() => hillHold.getAttribute('aria-checked')).toBe('true')
    await hillHold.click()
    await page.locator('label', { has: page.getByRole('radio', { name: 'Sport', exact: true }) }).click()
    await page.getByLabel('Point 3, Torque (%)').fill('40')
    await expect.poll(() => page.getByText(/^Changed:/).textContent()).toMatch(/Hill hold/)
    const said = await page.getByText(/^Changed:/).textContent()
    for (const t of ['Drive mode', 'Throttle map']) expect(said).toContain(t)
    expect(await page.locator('[data-changed]').count()).toBe(3)
    // Emptied, a point says so beside the table rather than leaving the send refused with no reason in sight.
    await page.getByLabel('Point 2, Pedal (%)').fill('')
    await expect.poll(() => page.locator('[data-curve-blank]').textContent()).toBe('Point 2 has no pedal: fill it in or remove the point.')
    await page.getByLabel('Point 2, Pedal (%)').fill('25')
    await page.locator('#roadside-rationale').fill('Sport mode and a softer middle pedal for the hill route')
    for (const box of await page.locator('textarea[id^="roadside-justify-"]').all()) await box.fill('Tried on the test route with the workshop\'s tester.')
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'roadside-03-switch-choice-curve')
    await page.getByRole('button', { name: 'Send version for review' }).click()
    await expect.poll(() => page.getByText(/sent for review; the engineers have been asked/).count()).toBe(1)
    const [created] = (await tester.call('GET', `/api/road-tests/${quennelTest}`)).body.roadsideVersions
    const { parameters } = (await tester.call('GET', `/api/versions/${created.id}`)).body
    expect(parameters).toMatchObject({ hillHold: false, driveMode: 'sport' })
    expect(parameters.throttleMap[2]).toEqual({ x: 50, y: 40 })
  })
})
