// Steps through the product's screens that more than one browser test takes, each as a person would.
import { expect } from 'vitest'
import type { Page } from 'playwright-core'
import { preDriveConfirmLabel } from '../../shared/schemas/road-test-cautions'

export const versionState = (page: Page) => page.locator('[data-state]').first().getAttribute('data-state')
export const warningRules = (page: Page) => page.locator('[data-panel="warnings"] [data-rule]').evaluateAll(els => els.map(e => e.getAttribute('data-rule')))

// From any screen: the car list, searched by stock ref as a workshop with many cars would.
export async function findCar(page: Page, stockRef: string) {
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Cars', exact: true }).click()
  await page.getByLabel(/Search make/).fill(stockRef)
  await expect.poll(() => page.getByRole('link', { name: stockRef, exact: true }).count()).toBe(1)
}

// On a version's page: save the edited draft, then wait for the sheet to say so.
export async function saveDraft(page: Page) {
  await page.getByRole('button', { name: 'Save draft' }).click()
  await expect.poll(() => page.getByRole('status').first().textContent()).toContain('Saved')
}

// On a saved draft: write the reason for each danger warning, then send it to an engineer.
export async function sendForReview(page: Page, justifications: Record<string, string> = {}) {
  for (const [rule, text] of Object.entries(justifications)) await page.locator(`#justify-${rule}`).fill(text)
  await page.getByRole('button', { name: 'Send for review' }).click()
  await expect.poll(() => versionState(page)).toBe('in-review')
}

export async function sendBack(page: Page, comment: string) {
  await page.getByLabel('Comment').fill(comment)
  await page.getByRole('button', { name: 'Send back to the tuner' }).click()
  await expect.poll(() => versionState(page)).toBe('rejected')
  await expect.poll(() => page.locator('[data-action="version.rejected"]').last().textContent()).toContain(comment)
}

export async function approve(page: Page, comment: string) {
  await page.getByLabel('Comment').fill(comment)
  await page.getByRole('button', { name: 'Approve for road test' }).click()
  await expect.poll(() => versionState(page)).toBe('approved')
}

// A verdict button: a radio inside a large label, its icon hidden from assistive technology.
const choose = (page: Page, name: string) => page.locator('label', { has: page.getByRole('radio', { name, exact: true }) }).click()

// The road-test wizard, screen by screen (it shows one check at a time, for a phone).
// Before setting off: the cautions read and the car ready (the tick goes in the record).
export const tickReady = (page: Page) => page.getByRole('checkbox', { name: preDriveConfirmLabel }).check()

export async function recordConditions(page: Page, c: { surface: string, ambientC: string, route: string }) {
  await tickReady(page)
  await page.getByText(c.surface, { exact: true }).click()
  await page.getByLabel(/Air temperature/).fill(c.ambientC)
  await page.getByLabel('Route').fill(c.route)
}

export async function recordHillStart(page: Page, gradientPct: string, rollbackMm: string) {
  await page.getByRole('button', { name: 'Start the checks' }).click()
  await expect.poll(() => page.getByRole('heading', { name: 'Hill start' }).count()).toBe(1)
  await expect.poll(() => page.getByText('The model expects:').count()).toBe(1)
  await page.getByLabel(/Gradient/).fill(gradientPct)
  await page.getByLabel(/Roll-back/).fill(rollbackMm)
  await choose(page, 'Pass')
}

export async function recordLiftOff(page: Page, feel: string) {
  await page.getByRole('button', { name: 'Next check' }).click()
  await expect.poll(() => page.getByRole('heading', { name: 'Lift-off regen' }).count()).toBe(1)
  await choose(page, feel)
  await choose(page, 'Pass')
}

// The other mandatory checks, all passed, the peak temperatures and a passing verdict; then saved.
export async function passTheRestAndSave(page: Page, peaks = { motor: '78', inverter: '61', battery: '30' }, beforeSave?: () => Promise<void>) {
  await passTheRest(page, peaks)
  await beforeSave?.()
  await page.getByRole('button', { name: 'Save the road test' }).click()
  await page.waitForURL(u => /^\/road-tests\/\d+$/.test(u.pathname))
  await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('Road test of')
}

export async function passTheRest(page: Page, peaks = { motor: '78', inverter: '61', battery: '30' }) {
  for (const title of ['Brake regen', 'Creep', 'Full-power pull']) {
    await page.getByRole('button', { name: 'Next check' }).click()
    await expect.poll(() => page.getByRole('heading', { name: title }).count()).toBe(1)
    await choose(page, 'Pass')
  }
  await page.getByRole('button', { name: 'Next check' }).click()
  await page.getByLabel(/Peak motor/).fill(peaks.motor)
  await page.getByLabel(/Peak inverter/).fill(peaks.inverter)
  await page.getByLabel(/Peak battery/).fill(peaks.battery)
  await choose(page, 'Pass')
  await passWorkshopChecks(page)
  await page.getByRole('button', { name: 'To the verdict' }).click()
  await choose(page, 'Pass')
}

// The workshop's own checks, after the drive checks, when it has any: each passed, a number one measured.
export async function passWorkshopChecks(page: Page, value = '13.9') {
  const next = page.getByRole('button', { name: 'To the workshop\'s checks' })
  if (!(await next.count())) return
  await next.click()
  await expect.poll(() => page.getByRole('heading', { name: 'The workshop\'s own checks' }).count()).toBe(1)
  for (const block of await page.locator('[data-extra-check]').all()) {
    const measured = block.getByLabel(/Measured/)
    if (await measured.count()) await measured.fill(value)
    await block.locator('label', { has: page.getByRole('radio', { name: 'Pass', exact: true }) }).click()
  }
}

export async function uploadLog(page: Page, file: string) {
  await page.locator('[data-test="telemetry-file"]').setInputFiles(file)
  await expect.poll(() => page.getByText('Log stored and summarised.').count(), { timeout: 30000 }).toBe(1)
  await expect.poll(() => page.getByRole('heading', { name: 'The log against the model' }).count()).toBe(1)
}

export async function signOff(page: Page, versionNo: number) {
  await page.getByRole('button', { name: `Sign off version ${versionNo}` }).click()
  await expect.poll(() => page.getByText(/^✓ Signed off/).count()).toBe(1)
}

// The auditor's bench: the whole workshop's chain, recomputed by the server.
export async function verifyChain(page: Page) {
  await page.getByRole('button', { name: 'Verify the history chain' }).click()
  await expect.poll(() => page.getByRole('status').first().textContent(), { timeout: 20000 }).toContain('Chain intact')
}
