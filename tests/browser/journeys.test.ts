import { execFileSync } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { describe, it, expect, afterAll } from 'vitest'
import type { Page } from 'playwright-core'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl, telemetryFile } from './helpers'
import { approve, findCar, passTheRestAndSave, recordConditions, recordHillStart, recordLiftOff, saveDraft, sendBack, sendForReview, signOff, uploadLog, verifyChain, versionState, warningRules } from './steps'
import { signIn, useRunningServer } from '../api/helpers'
import { newCar, newClient } from '../api/road-test-fixtures'
import { strongRegen } from '../api/version-fixtures'

// One car's whole story in the browser, each person at their own screen: a calmer profile for an owner's
// rear-driven coupé, through review, a road test and the history, to the owner's handover sheet.
// Only the owner's account and the booked-in car are set up through the API. Screens: tests/artifacts/journey-*.png.
describe('a car from the tuner\'s first draft to the owner\'s handover sheet', async () => {
  await useRunningServer()
  const owner = await newClient(await signIn('admin@voltwright.test'))
  const car = await newCar(await signIn('tuner@voltwright.test'), { ownerUserId: owner.id, model: 'Journey Coupé' })
  const profile = `Calm ${Date.now().toString(36)}`
  const opened: Awaited<ReturnType<typeof launch>>[] = [] // one browser for each person, as they come in
  const browser = async (width?: number) => { const b = await launch(width); opened.push(b); return b.page }
  afterAll(() => Promise.all(opened.map(b => b.context.close())))
  let n = 0
  const step = async (page: Page, name: string) => {
    await shot(page, `journey-${String(++n).padStart(2, '0')}-${name}`)
    expect(await accessibilityProblems(page)).toEqual([])
  }
  const heading = (page: Page) => page.getByRole('heading', { level: 1 }).textContent()
  const field = (page: Page, name: string) => page.getByRole('spinbutton', { name, exact: true })
  const justification = 'The owner lays the car up from November to March and never drives it on snow; the handover sheet says so.'
  const comment = 'A late frost in March is enough: 70 % lift-off regen asks the rear wheels for nearly twice their grip on snow. Lift-off regen down to 25 %, brake regen to 35 %, keep the 60 kW cap.'
  const urls = { v1: '', v2: '' }
  let tuner: Page, engineer: Page, tester: Page

  it('the tuner finds the owner\'s car and drafts reduced power with strong lift-off regen: a danger warning', async () => {
    tuner = await browser()
    await tuner.goto(`${baseUrl}/login`, { waitUntil: 'networkidle' })
    await step(tuner, 'tuner-sign-in')
    await signInThroughPage(tuner, 'tuner@voltwright.test')
    await step(tuner, 'tuner-bench')
    await findCar(tuner, car.stockRef)
    await step(tuner, 'tuner-finds-car')
    await tuner.getByRole('link', { name: car.stockRef, exact: true }).click()
    await expect.poll(() => heading(tuner)).toBe('1967 Testwick Journey Coupé')
    await step(tuner, 'tuner-car')
    await tuner.getByRole('navigation', { name: 'The car\'s pages' }).getByRole('link', { name: 'Settings and versions' }).click()
    await tuner.getByLabel(/New profile's name/).fill(profile)
    await tuner.getByRole('button', { name: 'Start a new profile' }).click()
    await tuner.waitForURL(/\/versions\/\d+$/)
    urls.v1 = tuner.url()
    await expect.poll(() => heading(tuner)).toBe(`${profile} profile, version 1`)
    await field(tuner, 'Power cap (kW)').fill('60') // down from the Marrick 110's 80 kW
    await field(tuner, 'Regen torque limit (N·m)').fill(String(strongRegen.regenTorqueLimitNm))
    await field(tuner, 'Lift-off regen (%)').fill(String(strongRegen.liftOffRegenPct))
    // The rear axle's grip on snow (μ 0.2) with the load moving forward: 0.2·9.81·0.5 / (1 + 0.2·500/2400) = 0.94 m/s².
    await expect.poll(() => warningRules(tuner)).toEqual(['regen-grip-snow', 'regen-grip-snow', 'stop-lamp'])
    const danger = tuner.locator('[data-panel="warnings"] [data-rule="regen-grip-snow"]').first()
    expect(await danger.textContent()).toContain('Danger')
    const lift = (await danger.textContent())!.match(/lifting off the accelerator brakes the rear wheels alone at about (\d\.\d\d) m\/s², more than the 0\.94 m\/s² they can grip/)
    expect(Number(lift?.[1])).toBeGreaterThan(0.94)
    await tuner.getByLabel('Rationale').fill('The owner\'s first year: 60 kW instead of 80 kW, and strong lift-off regen for one-pedal driving in town.')
    await saveDraft(tuner)
    await step(tuner, 'tuner-proposes')
  })

  it('the danger needs a written reason before the draft goes to review', async () => {
    await tuner.getByRole('button', { name: 'Send for review' }).click()
    await expect.poll(() => tuner.locator('#justify-regen-grip-snow-error').textContent()).toContain('Say why this is acceptable')
    expect(await versionState(tuner)).toBe('draft')
    await step(tuner, 'tuner-must-justify')
    await sendForReview(tuner, { 'regen-grip-snow': justification })
    await step(tuner, 'tuner-sent-for-review')
  })

  it('the engineer opens it from the review worklist, reads the reason and sends it back', async () => {
    engineer = await browser()
    await signInThroughPage(engineer, 'engineer@voltwright.test')
    const item = engineer.getByRole('region', { name: /Awaiting your review/ }).getByRole('listitem').filter({ hasText: `${profile} v1` })
    await expect.poll(() => item.textContent()).toMatch(/2 danger.*1 caution/s)
    await step(engineer, 'engineer-worklist')
    await item.getByRole('link').click()
    await engineer.waitForURL(urls.v1)
    await expect.poll(() => engineer.locator('[data-justified-rule="regen-grip-snow"]').first().textContent()).toContain(justification)
    await sendBack(engineer, comment)
    await step(engineer, 'engineer-sends-back')
  })

  it('the tuner reads the comment, revises as version 2 and sends it again; the engineer approves', async () => {
    await tuner.goto(baseUrl, { waitUntil: 'networkidle' })
    const sentBack = tuner.getByRole('region', { name: /Your tuning work/ }).getByRole('listitem').filter({ hasText: `${profile} v1` })
    await expect.poll(() => sentBack.textContent()).toContain(comment)
    await step(tuner, 'tuner-reads-comment')
    await sentBack.getByRole('link').click()
    await tuner.getByRole('button', { name: 'Start a new version from v1' }).click()
    await expect.poll(() => heading(tuner)).toBe(`${profile} profile, version 2`)
    urls.v2 = tuner.url()
    expect(await field(tuner, 'Power cap (kW)').inputValue()).toBe('60') // carried over from version 1
    await field(tuner, 'Lift-off regen (%)').fill('25')
    await field(tuner, 'Brake regen (%)').fill('35')
    await expect.poll(() => warningRules(tuner)).toEqual([])
    await tuner.getByLabel('Rationale').fill('As sent back: lift-off regen 25 %, brake regen 35 %, power cap 60 kW.')
    await saveDraft(tuner)
    await expect.poll(() => tuner.getByText(/^No danger warnings/).count()).toBe(1)
    await step(tuner, 'tuner-revises')
    await sendForReview(tuner)
    await engineer.goto(baseUrl, { waitUntil: 'networkidle' })
    await engineer.getByRole('link', { name: new RegExp(`${profile} v2`) }).click()
    await engineer.waitForURL(urls.v2)
    await approve(engineer, 'Lift-off and brake regen now inside the rear grip on snow. Road test on the wet loop.')
    await step(engineer, 'engineer-approves')
  })

  it('the tester records the road test on a phone, uploads the controller log and signs it off', async () => {
    tester = await browser(390)
    await signInThroughPage(tester, 'tester@voltwright.test')
    await step(tester, 'tester-bench')
    await tester.getByRole('link', { name: `Start the road test of Testwick Journey Coupé ${profile} v2` }).click()
    await tester.waitForURL(u => u.pathname === '/road-tests/new')
    await recordConditions(tester, { surface: 'Wet', ambientC: '11', route: 'Forge loop and Quarry Lane' })
    await step(tester, 'tester-conditions')
    await recordHillStart(tester, '12', '40')
    await step(tester, 'tester-hill-start')
    await recordLiftOff(tester, 'gentle')
    await step(tester, 'tester-lift-off')
    await passTheRestAndSave(tester, undefined, () => step(tester, 'tester-verdict'))
    expect(await tester.getByText('Gradient 12 %').count()).toBe(1)
    await step(tester, 'tester-road-test-saved')
    // A drive of this car at version 2's settings: 1050 kg and a driver, 165/80 R15, final drive 7.5, 350 V.
    await uploadLog(tester, telemetryFile('quarry-lane.csv', { massKg: 1130, rollingRadiusM: 0.31, finalDriveRatio: 7.5, powerCapKw: 60, torqueCapNm: 220, liftOffDecelMs2: 0.6, brakeRegenDecelMs2: 0.84, packVoltageV: 350, creepSpeedKph: 5 }, { rollbackM: 0.04 }))
    await expect.poll(() => tester.getByText('quarry-lane.csv').count()).toBe(1)
    await step(tester, 'tester-log')
    await signOff(tester, 2)
    await step(tester, 'tester-signs-off')
  })

  it('the auditor reads the car\'s history page and verifies the history chain from it', async () => {
    const auditor = await browser()
    await signInThroughPage(auditor, 'auditor@voltwright.test')
    await findCar(auditor, car.stockRef)
    await auditor.getByRole('link', { name: car.stockRef, exact: true }).click()
    await auditor.getByRole('navigation', { name: 'The car\'s pages' }).getByRole('link', { name: 'History' }).click()
    await auditor.getByRole('link', { name: 'Print view' }).click()
    await expect.poll(() => heading(auditor)).toBe(`History of ${car.stockRef} · 1967 Testwick Journey Coupé`)
    // Each entry opens with a sentence of what happened and who did it; the page lists the newest first.
    const entries = auditor.getByRole('main').locator('ol > li')
    await expect.poll(() => entries.count()).toBe(14)
    const story = await entries.evaluateAll(items => items.map(li => li.querySelector('[data-sentence]')!.textContent!.trim()).reverse())
    const expected = [
      `Dev Carrow booked in 1967 Testwick Journey Coupé as ${car.stockRef}.`, `Dev Carrow started the profile ${profile}.`, `Dev Carrow drafted ${profile} v1.`, `Dev Carrow edited the draft ${profile} v1.`,
      `Dev Carrow sent ${profile} v1 for review with`, `Maud Ellery sent ${profile} v1 back to its author.`, `Dev Carrow drafted ${profile} v2 from ${profile} v1.`, `Dev Carrow edited the draft ${profile} v2.`,
      `Dev Carrow sent ${profile} v2 for review`, `Maud Ellery approved ${profile} v2.`, 'Sol Brannagh moved the car from ', `Sol Brannagh recorded a road test of ${profile} v2: passed.`,
      `Sol Brannagh uploaded the controller log quarry-lane.csv for the road test of ${profile} v2.`, `Sol Brannagh signed ${profile} v2 off onto the car; the car moved from road testing to`
    ]
    expect(story.map((s, i) => s.startsWith(expected[i]!) ? expected[i] : s)).toEqual(expected)
    expect(await entries.filter({ hasText: 'version.rejected' }).textContent()).toContain(comment)
    expect(await entries.filter({ hasText: 'quarry-lane.csv' }).textContent()).toContain('road-test.telemetry-uploaded')
    await step(auditor, 'auditor-car-history')
    await verifyChain(auditor)
    expect(await auditor.getByText(/events checked in/).textContent()).toMatch(/^\d[\d,]* events checked in [\d.]+ s; every link and every hash holds\.$/)
    await step(auditor, 'auditor-chain-verified')
  })

  it('the owner signs in, reads their car in plain words and downloads the handover sheet', async () => {
    const client = await browser()
    await signInThroughPage(client, owner.email, 'owner-password-123')
    await expect.poll(() => client.getByRole('region', { name: 'My cars' }).getByRole('link').count()).toBe(1)
    await step(client, 'owner-bench')
    await client.getByRole('link', { name: /1967 Testwick Journey Coupé/ }).click()
    await expect.poll(() => client.getByText('(settings version 2)').count()).toBe(1)
    expect(await client.getByRole('region', { name: 'How the car is set up' }).textContent()).toContain('power limited to 60 kW (80 hp)')
    expect(await client.getByRole('region', { name: 'Road test' }).textContent()).toMatch(/Passed.*on a wet road/s)
    await step(client, 'owner-car')
    const [download] = await Promise.all([client.waitForEvent('download'), client.getByRole('link', { name: 'Download the handover sheet (PDF)' }).click()])
    expect(download.suggestedFilename()).toBe(`handover-${car.stockRef}.pdf`)
    const pdf = readFileSync((await download.path())!)
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-')
    const text = execFileSync('pdftotext', ['-layout', '-', '-'], { input: pdf, encoding: 'utf8' }) // poppler-utils
    expect(text).toContain(`Stock ref ${car.stockRef}`)
    expect(text).toContain('60 kW (80 hp)') // 60 kW / 745.7 W = 80.46 hp (NIST SP 811)
    expect(text).toMatch(/Lift-off regen\s+25 %/)
    expect(text).toMatch(/Regen torque limit\s+120 N·m/)
  })
})
