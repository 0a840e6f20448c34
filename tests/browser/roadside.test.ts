import { describe, it, expect, afterAll } from 'vitest'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl } from './helpers'
import { useRunningServer, signIn } from '../api/helpers'
import { approvedVersion, newCar, newProfile, recordRoadTest } from '../api/road-test-fixtures'

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
})
