import { describe, it, expect, afterAll } from 'vitest'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl, telemetryFile } from './helpers'
import { passTheRestAndSave, recordConditions, recordHillStart, recordLiftOff, signOff, uploadLog } from './steps'
import { useRunningServer, signIn } from '../api/helpers'
import { approvedVersion, newCar, newProfile } from '../api/road-test-fixtures'

describe('a tester road-tests a car on a phone and signs it off', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const car = await newCar(tuner, { model: 'Phone Test Saloon' })
  const versionId = await approvedVersion(await newProfile(car.id))
  const log = telemetryFile('forge-loop.csv', { massKg: 1200, rollingRadiusM: 0.296, finalDriveRatio: 7.5, powerCapKw: 80, torqueCapNm: 260, liftOffDecelMs2: 0.9, brakeRegenDecelMs2: 1.6, packVoltageV: 350, creepSpeedKph: 5 }, { rollbackM: 0.05 })
  const { context, page } = await launch(390)
  afterAll(() => context.close())

  it('finds the approved version on the bench and records the conditions', async () => {
    await signInThroughPage(page, 'tester@voltwright.test')
    await page.getByRole('link', { name: new RegExp(`Start the road test of Testwick Phone Test Saloon`) }).first().click()
    await page.waitForURL(u => u.pathname === '/road-tests/new')
    expect(new URL(page.url()).searchParams.get('version')).toBe(String(versionId))
    await recordConditions(page, { surface: 'Wet', ambientC: '9', route: 'Forge loop and Quarry Lane' })
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'road-test-01-conditions')
  })

  it('records the hill start and the lift-off verdict, one check at a time', async () => {
    await recordHillStart(page, '16', '50')
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'road-test-02-hill-start')
    await recordLiftOff(page, 'gentle')
    await shot(page, 'road-test-03-lift-off')
    await passTheRestAndSave(page, undefined, () => shot(page, 'road-test-04-verdict'))
    expect(await page.getByText('Gradient 16 %').count()).toBe(1)
  })

  it('uploads the controller log with progress, then shows the summary and the model against it', async () => {
    await uploadLog(page, log)
    await expect.poll(() => page.getByText('Strongest lift-off slowing (0.5 s mean)').count()).toBe(1)
    await expect.poll(() => page.locator('canvas').count()).toBe(2)
    expect(await page.getByText('Gradient tested').count()).toBe(1)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'road-test-05-log-and-chart')
  })

  it('signs the version off', async () => {
    await signOff(page, 1)
    await expect.poll(async () => (await tuner.call('GET', `/api/vehicles/${car.id}`)).body.status).toBe('handed-over')
    await shot(page, 'road-test-06-signed-off')
    await page.goto(`${baseUrl}/cars/${car.id}/handover`, { waitUntil: 'networkidle' })
    await expect.poll(() => page.getByRole('heading', { name: 'Handover sheet' }).count()).toBe(1)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'road-test-07-handover')
  })
})
