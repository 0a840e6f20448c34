import { describe, it, expect, afterAll } from 'vitest'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl } from './helpers'
import { approve, saveDraft, sendBack, sendForReview } from './steps'

// One proposal's way through four eyes: the tuner edits and sends it, the engineer sends it back with a
// comment, the tuner revises it as a new version, the engineer approves it.
describe('a tuner proposes, an engineer reviews', async () => {
  const tuner = await launch()
  const engineer = await launch()
  afterAll(async () => { await tuner.context.close(); await engineer.context.close() })
  const profileName = `Town ${Date.now().toString(36)}`
  const comment = 'Lift-off regen is too soft for the owner\'s hilly commute; raise it to 25 % and keep the power cap.'
  let firstUrl = ''

  it('the tuner starts a profile on a converting car, edits the draft and sends it for review', async () => {
    const page = tuner.page
    await signInThroughPage(page, 'tuner@voltwright.test')
    await page.goto(`${baseUrl}/cars`, { waitUntil: 'networkidle' })
    await page.getByRole('link', { name: 'OF-102' }).click()
    await page.getByRole('navigation', { name: 'The car\'s pages' }).getByRole('link', { name: 'Settings and versions' }).click()
    await page.getByLabel(/New profile's name/).fill(profileName)
    await page.getByRole('button', { name: 'Start a new profile' }).click()
    await page.waitForURL(/\/versions\/\d+$/)
    firstUrl = page.url()
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain(`${profileName} profile, version 1`)
    await page.locator('#param-powerCapKw').fill('60')
    await page.locator('#param-liftOffRegenPct').fill('10')
    await page.getByLabel('Rationale').fill('Town use: 60 kW and gentle lift-off while the owner gets used to it.')
    await saveDraft(page)
    await shot(page, 'versions-01-draft-saved')
    expect(await accessibilityProblems(page)).toEqual([])
    await sendForReview(page)
    await shot(page, 'versions-02-sent')
  })

  it('the engineer finds it on the Bench and sends it back with a comment', async () => {
    const page = engineer.page
    await signInThroughPage(page, 'engineer@voltwright.test')
    await page.getByRole('link', { name: new RegExp(`${profileName} v1`) }).click()
    await page.waitForURL(firstUrl)
    await page.getByRole('button', { name: 'Send back to the tuner' }).click()
    await expect.poll(() => page.locator('#review-comment-error').textContent()).toContain('Say what needs to change')
    await sendBack(page, comment)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'versions-03-sent-back')
  })

  it('the tuner reads the comment on the Bench, revises as version 2 and sends it again', async () => {
    const page = tuner.page
    await page.goto(baseUrl, { waitUntil: 'networkidle' })
    await expect.poll(() => page.getByRole('region', { name: /Your tuning work/ }).textContent()).toContain(comment)
    await shot(page, 'versions-04-bench-sent-back')
    await page.getByRole('link', { name: new RegExp(`${profileName} v1`) }).click()
    await page.getByRole('button', { name: 'Start a new version from v1' }).click()
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('version 2')
    await page.locator('#param-liftOffRegenPct').fill('25')
    await saveDraft(page)
    await sendForReview(page)
    await shot(page, 'versions-05-revised-sent')
  })

  it('the engineer compares version 2 with its parent and approves it', async () => {
    const page = engineer.page
    await page.goto(baseUrl, { waitUntil: 'networkidle' })
    await page.getByRole('link', { name: new RegExp(`${profileName} v2`) }).click()
    await page.getByRole('link', { name: /Compare with its parent, v1/ }).click()
    await page.waitForURL(/\/compare\//)
    await expect.poll(() => page.locator('[data-parameter="liftOffRegenPct"]').textContent()).toMatch(/10\s*%.*25\s*%.*\+15\s*points.*\+150\s*%/) // a percent setting moves by percentage points
    expect(await page.locator('[data-parameter]').count()).toBe(1)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'versions-06-compare')
    await page.goBack({ waitUntil: 'networkidle' })
    await approve(page, 'Good: regen inside the rear grip in the wet.')
    await shot(page, 'versions-07-approved')
  })
})
