import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, it, expect, afterAll } from 'vitest'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl } from './helpers'
import { useRunningServer, signIn } from '../api/helpers'
import { approvedVersion, newCar, newProfile } from '../api/road-test-fixtures'
import { syntheticDrive, telemetryCsv } from '../../shared/telemetry/synthetic'

describe('a tester road-tests a car on a phone and signs it off', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const car = await newCar(tuner, { model: 'Phone Test Saloon' })
  const versionId = await approvedVersion(await newProfile(car.id))
  const log = join(mkdtempSync(join(tmpdir(), 'voltwright-log-')), 'forge-loop.csv')
  writeFileSync(log, telemetryCsv(syntheticDrive({ massKg: 1200, rollingRadiusM: 0.296, finalDriveRatio: 7.5, powerCapKw: 80, torqueCapNm: 260, liftOffDecelMs2: 0.9, brakeRegenDecelMs2: 1.6, packVoltageV: 350, creepSpeedKph: 5 }, { rollbackM: 0.05 })))
  const { context, page } = await launch(390)
  afterAll(() => context.close())

  it('finds the approved version on the bench and records the conditions', async () => {
    await signInThroughPage(page, 'tester@voltwright.test')
    await page.getByRole('link', { name: new RegExp(`Start the road test of Testwick Phone Test Saloon`) }).first().click()
    await page.waitForURL(u => u.pathname === '/road-tests/new')
    expect(new URL(page.url()).searchParams.get('version')).toBe(String(versionId))
    await page.getByText('Wet', { exact: true }).click()
    await page.getByLabel(/Air temperature/).fill('9')
    await page.getByLabel('Route').fill('Forge loop and Quarry Lane')
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'road-test-01-conditions')
    await page.getByRole('button', { name: 'Start the checks' }).click()
  })

  it('records the hill start and the lift-off verdict, one check at a time', async () => {
    await expect.poll(() => page.getByRole('heading', { name: 'Hill start' }).count()).toBe(1)
    await expect.poll(() => page.getByText('The model expects:').count()).toBe(1)
    await page.getByLabel(/Gradient/).fill('16')
    await page.getByLabel(/Roll-back/).fill('50')
    await page.getByText('Pass', { exact: true }).click()
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'road-test-02-hill-start')
    await page.getByRole('button', { name: 'Next check' }).click()
    await expect.poll(() => page.getByRole('heading', { name: 'Lift-off regen' }).count()).toBe(1)
    await page.getByText('gentle', { exact: true }).click()
    await page.getByText('Pass', { exact: true }).click()
    await shot(page, 'road-test-03-lift-off')
    for (const title of ['Brake regen', 'Creep', 'Full-power pull']) {
      await page.getByRole('button', { name: 'Next check' }).click()
      await expect.poll(() => page.getByRole('heading', { name: title }).count()).toBe(1)
      await page.getByText('Pass', { exact: true }).click()
    }
    await page.getByRole('button', { name: 'Next check' }).click()
    await page.getByLabel(/Peak motor/).fill('78')
    await page.getByLabel(/Peak inverter/).fill('61')
    await page.getByLabel(/Peak battery/).fill('30')
    await page.getByText('Pass', { exact: true }).click()
    await page.getByRole('button', { name: 'To the verdict' }).click()
    await page.getByText('Pass', { exact: true }).click()
    await shot(page, 'road-test-04-verdict')
    await page.getByRole('button', { name: 'Save the road test' }).click()
    await page.waitForURL(u => /^\/road-tests\/\d+$/.test(u.pathname))
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('Road test of')
    expect(await page.getByText('Gradient 16 %').count()).toBe(1)
  })

  it('uploads the controller log with progress, then shows the summary and the model against it', async () => {
    await page.locator('[data-test="telemetry-file"]').setInputFiles(log)
    await expect.poll(() => page.getByText('Log stored and summarised.').count(), { timeout: 30000 }).toBe(1)
    await expect.poll(() => page.getByText('Strongest lift-off slowing (0.5 s mean)').count()).toBe(1)
    await expect.poll(() => page.locator('canvas').count()).toBe(2)
    await expect.poll(() => page.getByRole('heading', { name: 'The log against the model' }).count()).toBe(1)
    expect(await page.getByText('Gradient tested').count()).toBe(1)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'road-test-05-log-and-chart')
  })

  it('signs the version off', async () => {
    await page.getByRole('button', { name: 'Sign off version 1' }).click()
    await expect.poll(() => page.getByText(/^✓ Signed off/).count()).toBe(1)
    await expect.poll(async () => (await tuner.call('GET', `/api/vehicles/${car.id}`)).body.status).toBe('handed-over')
    await shot(page, 'road-test-06-signed-off')
    await page.goto(`${baseUrl}/cars/${car.id}/handover`, { waitUntil: 'networkidle' })
    await expect.poll(() => page.getByRole('heading', { name: 'Handover sheet' }).count()).toBe(1)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'road-test-07-handover')
  })
})
