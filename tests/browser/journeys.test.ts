import { mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, it, expect, afterAll } from 'vitest'
import type { Page } from 'playwright-core'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl } from './helpers'
import { approve, passTheRestAndSave, recordConditions, recordHillStart, recordLiftOff, saveDraft, sendBack, sendForReview, signOff, uploadLog, verifyChain, versionState, warningRules } from './steps'
import { syntheticDrive, telemetryCsv } from '../../shared/telemetry/synthetic'

// One story from sign-in to the last screen, as the six people of the workshop meet it: a calmer power and
// regen profile for the client's rear-driven roadster (OF-101), through four eyes, a road test, the
// history and the handover. Each screen is kept as tests/artifacts/journey-NN-*.png.
const CAR = 'OF-101'
const MODEL = 'Penhallow Marten Roadster'
let n = 0
const step = async (page: Page, name: string, axe = true) => {
  await shot(page, `journey-${String(++n).padStart(2, '0')}-${name}`)
  if (axe) expect(await accessibilityProblems(page)).toEqual([])
}
const heading = (page: Page) => page.getByRole('heading', { level: 1 }).textContent()
const versionNoOf = async (page: Page) => Number((await heading(page))!.match(/version (\d+)/)![1])

describe('the whole story of a calmer profile, from the tuner\'s idea to the owner\'s handover sheet', async () => {
  const people = { tuner: await launch(), engineer: await launch(), tester: await launch(390), auditor: await launch(), client: await launch() }
  afterAll(() => Promise.all(Object.values(people).map(p => p.context.close())))
  const justification = 'Brake regen at 100 % recovers energy on the owner\'s long descent to the coast; the owner lays the car up from November to March and the handover sheet says it must not be driven on snow.'
  const comment = 'Brake regen at 100 % asks the rear wheels alone for about 1.6 m/s² before the drums add theirs: too much on snow and close to it in the wet. Bring brake regen down to 50 % and keep the rest.'
  let carUrl = ''
  const versions = { first: { id: 0, no: 0 }, second: { id: 0, no: 0 } }
  let roadTestUrl = ''

  it('the tuner signs in, opens the client\'s roadster and starts a new version from its latest one', async () => {
    const page = people.tuner.page
    await page.goto(`${baseUrl}/login`, { waitUntil: 'networkidle' })
    await step(page, 'sign-in')
    await signInThroughPage(page, 'tuner@voltwright.test')
    await expect.poll(() => page.getByRole('heading', { name: 'Bench' }).count()).toBe(1)
    await step(page, 'tuner-bench')
    await page.getByRole('link', { name: 'Cars' }).first().click()
    // The list holds the other tests' cars too: search, as a workshop with many cars would.
    await page.getByLabel(/Search make/).fill(CAR)
    await page.getByRole('link', { name: CAR }).click()
    await expect.poll(() => heading(page)).toContain(MODEL)
    carUrl = page.url()
    const road = page.getByRole('article', { name: 'Road', exact: true })
    await expect.poll(() => road.locator('tbody tr').count()).toBeGreaterThan(0)
    const latest = Number(await road.locator('tbody tr').first().getAttribute('data-version'))
    await step(page, 'tuner-car')
    await road.getByRole('button', { name: `New version from v${latest}` }).click()
    await page.waitForURL(/\/versions\/\d+$/)
    await expect.poll(() => heading(page)).toContain(`Road profile, version ${latest + 1}`)
    versions.first = { id: Number(page.url().split('/').pop()), no: latest + 1 }
  })

  it('lowers the power cap and lift-off regen, raises brake regen, and meets one danger warning', async () => {
    const page = people.tuner.page
    await page.locator('#param-powerCapKw').fill('35')
    await page.locator('#param-liftOffRegenPct').fill('15')
    await page.locator('#param-brakeRegenPct').fill('100')
    // 100 % of 80 N·m on the rear axle alone is about 1.6 m/s², more than snow grips (regen-grip-snow).
    await expect.poll(() => warningRules(page)).toEqual(['regen-grip-snow'])
    const warning = page.locator('[data-panel="warnings"] [data-rule="regen-grip-snow"]')
    expect(await warning.locator('[data-severity]').textContent()).toContain('Danger')
    expect(await warning.textContent()).toMatch(/brake regen alone asks .*rear.* for about 1\.6 m\/s²/s)
    await page.getByLabel('Rationale').fill('Calmer for the owner\'s first year: 35 kW instead of 42 kW, lift-off regen 15 %, more brake regen to recover energy downhill.')
    await saveDraft(page)
    await step(page, 'tuner-draft-danger')
  })

  it('the tuner must justify the danger before it goes, then sends it for review', async () => {
    const page = people.tuner.page
    await page.getByRole('button', { name: 'Send for review' }).click()
    await expect.poll(() => page.locator('#justify-regen-grip-snow-error').textContent()).toContain('Say why this is acceptable')
    expect(await versionState(page)).toBe('draft')
    await sendForReview(page, { 'regen-grip-snow': justification })
    await step(page, 'tuner-sent-for-review')
  })

  it('the engineer finds it on the bench, reads the justification and sends it back with a comment', async () => {
    const page = people.engineer.page
    await signInThroughPage(page, 'engineer@voltwright.test')
    const item = page.locator(`[data-version-id="${versions.first.id}"]`)
    await expect.poll(() => item.textContent()).toMatch(/1 danger/)
    await step(page, 'engineer-bench')
    await item.getByRole('link').click()
    await page.waitForURL(`${baseUrl}/versions/${versions.first.id}`)
    await expect.poll(() => page.locator('[data-justified-rule="regen-grip-snow"]').textContent()).toContain(justification)
    await sendBack(page, comment)
    await step(page, 'engineer-sent-back')
  })

  it('the tuner reads the comment, revises from the rejected version and sends the revision', async () => {
    const page = people.tuner.page
    await page.goto(baseUrl, { waitUntil: 'networkidle' })
    const sentBackItem = page.locator(`[data-version-id="${versions.first.id}"]`)
    await expect.poll(() => sentBackItem.textContent()).toContain(comment)
    await step(page, 'tuner-bench-sent-back')
    await sentBackItem.getByRole('link').click()
    await page.getByRole('button', { name: `Start a new version from v${versions.first.no}` }).click()
    await expect.poll(() => heading(page)).toContain(`version ${versions.first.no + 1}`)
    versions.second = { id: Number(page.url().split('/').pop()), no: await versionNoOf(page) }
    expect(await page.locator('#param-powerCapKw').inputValue()).toBe('35') // carried over from the rejected version
    await page.locator('#param-brakeRegenPct').fill('50')
    await expect.poll(() => warningRules(page)).toEqual([])
    await page.getByLabel('Rationale').fill('As sent back: brake regen 50 % (about 1 m/s² on the rear axle), power cap 35 kW, lift-off regen 15 %.')
    await saveDraft(page)
    await expect.poll(() => page.getByText('No danger warnings').count()).toBe(1)
    await step(page, 'tuner-revision')
    await sendForReview(page)
  })

  it('the engineer compares the revision with the rejected version and approves it', async () => {
    const page = people.engineer.page
    await page.goto(baseUrl, { waitUntil: 'networkidle' })
    await page.locator(`[data-version-id="${versions.second.id}"]`).getByRole('link').click()
    await page.getByRole('link', { name: new RegExp(`Compare with its parent, v${versions.first.no}`) }).click()
    await page.waitForURL(/\/compare\//)
    await expect.poll(() => page.locator('[data-parameter="brakeRegenPct"]').textContent()).toMatch(/100\s*%.*50\s*%.*[−-]50\s*%/)
    expect(await page.locator('[data-parameter]').count()).toBe(1)
    await step(page, 'engineer-compare')
    await page.goBack({ waitUntil: 'networkidle' })
    await approve(page, 'Good: brake regen well inside the rear grip in the wet; road test on the wet loop too.')
    await step(page, 'engineer-approved')
  })

  it('the tester, on a phone, records the conditions, the hill start and the lift-off verdict', async () => {
    const page = people.tester.page
    await signInThroughPage(page, 'tester@voltwright.test')
    await step(page, 'tester-bench')
    await page.getByRole('link', { name: `Start the road test of ${MODEL} Road v${versions.second.no}` }).click()
    await page.waitForURL(u => u.pathname === '/road-tests/new')
    expect(new URL(page.url()).searchParams.get('version')).toBe(String(versions.second.id))
    await recordConditions(page, { surface: 'Wet', ambientC: '8', route: 'Forge loop, Quarry Lane hill and the coast road descent' })
    await step(page, 'tester-conditions')
    await recordHillStart(page, '14', '40')
    await step(page, 'tester-hill-start')
    await recordLiftOff(page, 'gentle')
    await step(page, 'tester-lift-off', false)
    await passTheRestAndSave(page, undefined, () => step(page, 'tester-verdict', false))
    roadTestUrl = page.url()
    expect(await page.getByText('Gradient 14 %').count()).toBe(1)
  })

  it('uploads the controller log, sees it against the model, and signs the version off', async () => {
    const page = people.tester.page
    // A synthetic drive of this car at these settings (OF-101: 905 kg, 155/80 R13, final drive 7.2, 355 V pack).
    const log = join(mkdtempSync(join(tmpdir(), 'voltwright-journey-')), 'coast-road.csv')
    writeFileSync(log, telemetryCsv(syntheticDrive({ massKg: 985, rollingRadiusM: 0.289, finalDriveRatio: 7.2, powerCapKw: 35, torqueCapNm: 150, liftOffDecelMs2: 0.3, brakeRegenDecelMs2: 1.0, packVoltageV: 355, creepSpeedKph: 5 }, { rollbackM: 0.04 })))
    await uploadLog(page, log)
    expect(await page.getByText('Gradient tested').count()).toBe(1)
    await step(page, 'tester-log')
    await signOff(page, versions.second.no)
    await step(page, 'tester-signed-off')
  })

  it('the auditor reads the car\'s history, with this story in it, and verifies the chain', async () => {
    const page = people.auditor.page
    await signInThroughPage(page, 'auditor@voltwright.test')
    await verifyChain(page)
    expect(await page.getByText(/events checked in/).textContent()).toMatch(/^\d[\d,]* events checked/)
    await step(page, 'auditor-chain-intact')
    await page.goto(carUrl, { waitUntil: 'networkidle' })
    const history = page.getByRole('region', { name: 'History' })
    // Every kind of event this story wrote, in words (none shown as a raw action name).
    for (const label of ['Signed off onto the car', 'Controller log uploaded', 'Road test recorded', 'Approved', 'Sent back', 'Sent for review', 'Draft edited', 'Version drafted']) {
      await expect.poll(() => history.getByText(label, { exact: true }).count()).toBeGreaterThan(0)
    }
    // Each step of this story under its person's name (the demo people of seeders/20261201-0001-demo-workshop.ts).
    const entries = await history.locator('ol > li').evaluateAll(items => items.map(li => li.textContent ?? ''))
    const story = entries.filter(e => new RegExp(`Version\\s*(${versions.first.no}|${versions.second.no})(?!\\d)`).test(e) || /Road test|Controller log/.test(e))
    expect(story.find(e => e.includes('Signed off onto the car'))).toContain('by Sol Brannagh')
    expect(story.find(e => e.includes('Sent back'))).toContain('by Maud Ellery')
    expect(story.find(e => e.includes('Approved'))).toContain('by Maud Ellery')
    expect(story.filter(e => e.includes('Sent for review')).every(e => e.includes('by Dev Carrow'))).toBe(true)
    await step(page, 'auditor-car-history')
  })

  it('the client finds the car on their bench, reads it in plain words and downloads the handover sheet', async () => {
    const page = people.client.page
    await signInThroughPage(page, 'client@voltwright.test')
    await expect.poll(() => page.getByRole('heading', { name: 'My cars' }).count()).toBe(1)
    await step(page, 'client-bench')
    await page.getByRole('link', { name: new RegExp(MODEL) }).click()
    await expect.poll(() => heading(page)).toContain(MODEL)
    await expect.poll(() => page.getByText(`(settings version ${versions.second.no})`).count()).toBe(1)
    expect(await page.getByText(/power limited to 35 kW \(47 hp\)/).count()).toBeGreaterThan(0) // 35 kW / 745.7 W = 46.9 hp (NIST SP 811)
    await step(page, 'client-car')
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: /Download the handover sheet/ }).click()])
    expect(download.suggestedFilename()).toBe(`handover-${CAR}.pdf`)
    const file = await download.path()
    expect(readFileSync(file).subarray(0, 5).toString('latin1')).toBe('%PDF-') // ISO 32000-1 §7.5.2: the header
    expect(statSync(file).size).toBeGreaterThan(2000)
    expect(readFileSync(file).subarray(-1024).toString('latin1')).toContain('%%EOF')
    expect(roadTestUrl).toMatch(/\/road-tests\/\d+$/)
  })
})
