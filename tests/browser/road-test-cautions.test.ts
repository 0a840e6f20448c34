import { describe, it, expect, afterAll } from 'vitest'
import type { Page } from 'playwright-core'
import { launch, shot, accessibilityProblems, baseUrl, signInByApi } from './helpers'
import { passTheRestAndSave, recordConditions, recordHillStart, recordLiftOff } from './steps'
import { useRunningServer, signIn } from '../api/helpers'
import { approvedVersion, newCar, newProfile, passingChecks, recordRoadTest } from '../api/road-test-fixtures'
import { preDriveCautions, preDriveDeferral } from '../../shared/schemas/road-test-cautions'
import { internalNameIn } from '../unit/internal-names'

const stepButtons = (page: Page) => page.getByRole('navigation', { name: 'Road-test steps' }).getByRole('button')
const rowsOf = async (page: Page) => new Set(await stepButtons(page).evaluateAll(bs => bs.map(b => Math.round(b.getBoundingClientRect().top)))).size
const sideways = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)

describe('a road test begins with the cautions, and its steps read as words', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const car = await newCar(tuner, { model: 'Caution Saloon' })
  const versionId = await approvedVersion(await newProfile(car.id))
  const { context, page } = await launch(390)
  afterAll(() => context.close())

  it('shows the cautions, defers to the regulations and the engineer, and will not start the checks unticked', async () => {
    await signInByApi(page, 'tester@voltwright.test')
    await page.goto(`${baseUrl}/road-tests/new?versionId=${versionId}`, { waitUntil: 'networkidle' })
    const caution = page.locator('[data-pre-drive]')
    await expect.poll(() => caution.getByRole('heading', { name: 'Caution: before you set off' }).count()).toBe(1)
    const text = await caution.textContent()
    for (const c of preDriveCautions) expect(text).toContain(`${c.title}. ${c.text}`)
    expect(text).toContain(preDriveDeferral)
    expect(await caution.locator('[data-way-back]').textContent()).toContain('No earlier version of this profile was signed off')
    await page.getByRole('button', { name: 'Start the checks' }).click()
    await expect.poll(() => caution.getByRole('alert').textContent()).toContain('Tick that you have read the cautions and the car is ready')
    expect(await page.getByRole('heading', { name: 'Hill start' }).count()).toBe(0)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'road-test-cautions-01-unticked')
  })

  it('names every step in words with an accessible name, in two rows on a phone and one on a desktop, never scrolling sideways', async () => {
    const labels = (await stepButtons(page).allTextContents()).map(t => t.trim())
    expect(labels.slice(0, 7)).toEqual(['Set off', 'Hill start', 'Lift-off regen', 'Brake regen', 'Creep', 'Full power', 'Thermal soak'])
    expect(labels.at(-1)).toBe('Verdict')
    const names = await stepButtons(page).evaluateAll(bs => bs.map(b => b.getAttribute('aria-label') ?? ''))
    names.forEach((n, i) => expect(n.startsWith(labels[i]!) && n.endsWith(`, step ${i + 1} of ${labels.length}`), n).toBe(true))
    expect(await rowsOf(page)).toBe(2)
    for (let i = 0; i < labels.length; i++) {
      await stepButtons(page).nth(i).click()
      expect(await sideways(page), labels[i]).toBe(0)
    }
    await page.setViewportSize({ width: 1280, height: 900 })
    expect(await rowsOf(page)).toBe(1)
    await page.setViewportSize({ width: 390, height: 900 })
    await stepButtons(page).first().click()
  })

  it('keeps the tick with the record and says so on the road test\'s page', async () => {
    await recordConditions(page, { surface: 'Dry', ambientC: '12', route: 'Forge loop' })
    await recordHillStart(page, '14', '30')
    expect(await stepButtons(page).nth(1).getAttribute('aria-label')).toBe(`Hill start, step 2 of ${await stepButtons(page).count()}, passed`)
    await recordLiftOff(page, 'gentle')
    await passTheRestAndSave(page)
    const confirmed = page.locator('[data-pre-drive-record]')
    await expect.poll(() => confirmed.textContent()).toContain('Sol Brannagh read the pre-drive cautions (“Two people, a quiet road”,')
    expect(await page.locator('[data-road-test-stage]').textContent()).toBe('Not signed off yet')
    expect(internalNameIn(await page.locator('main').innerText())).toBeUndefined()
    expect(await sideways(page)).toBe(0)
    await shot(page, 'road-test-cautions-02-open-record')
  })

  it('shows a failed road test with the snags it raised and no sign-off to press', async () => {
    const failedCar = await newCar(tuner, { model: 'Failed Saloon' })
    const v = await approvedVersion(await newProfile(failedCar.id))
    const checks = passingChecks()
    checks[1] = { key: 'lift-off-regen', verdict: 'fail', values: { decelMs2: 1.7333333, feel: 'harsh' }, note: 'Tail stepped out on the wet roundabout' } as never
    const id = await recordRoadTest(tester, v, { checks, verdict: 'fail' })
    await tester.call('POST', `/api/vehicles/${failedCar.id}/snags`, { kind: 'conversion', priority: 'high', blocking: true, roadTestId: id, title: 'Lift-off regen steps the tail out', detail: '' })
    await page.goto(`${baseUrl}/road-tests/${id}`, { waitUntil: 'networkidle' })
    const snags = page.locator('[data-road-test-snags]')
    await expect.poll(() => snags.textContent()).toContain('Lift-off regen steps the tail out')
    expect(await snags.textContent()).toContain('Open, blocks sign-off')
    expect(await page.locator('[data-road-test-stage]').textContent()).toBe('Failed: it cannot sign the version off')
    expect(await page.getByRole('button', { name: /^Sign off/ }).count()).toBe(0)
    expect(await page.getByText('Deceleration 1.73 m/s²').count()).toBe(1)
    expect(internalNameIn(await page.locator('main').innerText())).toBeUndefined()
    expect(await sideways(page)).toBe(0)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'road-test-cautions-03-failed-record')
    await page.goto(`${baseUrl}/road-tests/new?versionId=${v}`, { waitUntil: 'networkidle' })
    await expect.poll(() => page.locator('[data-failed-earlier]').textContent()).toContain('This version failed a road test on')
    expect(await page.locator('[data-failed-earlier]').getByRole('link', { name: 'Read what it found' }).getAttribute('href')).toBe(`/road-tests/${id}`)
    expect(await page.locator('[data-blocking-snags]').textContent()).toContain('Lift-off regen steps the tail out')
    expect(await sideways(page)).toBe(0)
    await shot(page, 'road-test-cautions-04-after-a-failure')
  })
})
