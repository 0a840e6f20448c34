import { describe, it, expect, afterAll } from 'vitest'
import type { Page } from 'playwright-core'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl } from './helpers'

const figure = (page: Page, key: string) => page.locator(`[data-figure="${key}"] [data-value]`).textContent()
const rules = (page: Page) => page.locator('[data-panel="warnings"] [data-rule]').evaluateAll(els => els.map(e => e.getAttribute('data-rule')))

describe('trying settings on a car', async () => {
  const { context, page } = await launch()
  afterAll(() => context.close())
  let tryUrl = ''

  it('a tuner opens a car and its "Try settings" sheet with the drive unit\'s defaults', async () => {
    await signInThroughPage(page, 'tuner@voltwright.test')
    await page.goto(`${baseUrl}/cars`, { waitUntil: 'networkidle' })
    await page.getByRole('link', { name: 'OF-101' }).click()
    await page.getByRole('link', { name: 'Try settings' }).click()
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('Try settings on the 1962 Penhallow Marten Roadster')
    tryUrl = page.url()
    await expect.poll(() => page.locator('#param-powerCapKw').inputValue()).toBe('40') // the Fenlow 45 default
    await expect.poll(() => page.locator('[data-second-unit="powerCapKw"]').textContent()).toContain('54 hp') // 40 kW / 745.7 W (NIST SP 811)
    await expect.poll(() => page.locator('[data-chart] canvas').count()).toBe(4)
    expect(await rules(page)).toEqual([])
    await shot(page, 'tune-01-defaults')
    expect(await accessibilityProblems(page)).toEqual([])
  })

  it('raising lift-off regen on the rear-driven car brings the snow grip warning, in words', async () => {
    const before = await figure(page, 'liftOffDecelMs2')
    await page.locator('#param-liftOffRegenPct').fill('100')
    await expect.poll(() => rules(page)).toContain('regen-grip-snow')
    const warning = page.locator('[data-rule="regen-grip-snow"]')
    expect(await warning.locator('[data-severity]').textContent()).toContain('Danger')
    expect(await warning.textContent()).toMatch(/rear wheels alone.*qualified engineer/s)
    expect(await rules(page)).toContain('stop-lamp') // above 1.3 m/s² the stop lamps must light (UN R13-H 5.2.22.4)
    expect(await figure(page, 'liftOffDecelMs2')).not.toBe(before)
    await shot(page, 'tune-02-lift-off-regen')
  })

  it('a lower power cap shows slower acceleration, and weak creep a creep warning', async () => {
    const before = await figure(page, 'zeroTo100S')
    await page.locator('#param-powerCapKw').fill('20')
    await expect.poll(() => figure(page, 'zeroTo100S')).not.toBe(before)
    const slower = Number.parseFloat((await figure(page, 'zeroTo100S'))!)
    expect(slower).toBeGreaterThan(Number.parseFloat(before!))
    expect(await page.locator('[data-second-unit="powerCapKw"]').textContent()).toContain('27 hp') // 20 kW = 26.8 hp
    const creepBefore = await figure(page, 'creepHoldGradePct')
    await page.locator('#param-creepTorqueNm').fill('10')
    await expect.poll(() => rules(page)).toContain('creep-hold')
    expect(await figure(page, 'creepHoldGradePct')).not.toBe(creepBefore)
    await shot(page, 'tune-03-power-and-creep')
    expect(await accessibilityProblems(page)).toEqual([])
  })

  it('shows a value out of the drive unit\'s range beside its field, then goes back to the defaults', async () => {
    await page.locator('#param-powerCapKw').fill('400')
    await expect.poll(() => page.locator('#param-powerCapKw-error').textContent()).toContain('at most 45 kW')
    expect(await page.locator('#param-powerCapKw').getAttribute('aria-invalid')).toBe('true')
    await shot(page, 'tune-04-out-of-range')
    await page.getByRole('button', { name: 'The Fenlow 45 defaults' }).click()
    await expect.poll(() => rules(page)).toEqual([])
    expect(await page.locator('#param-powerCapKw-error').count()).toBe(0)
  })

  it('on a car with settings signed off, starts from them and offers the defaults beside them', async () => {
    await page.goto(`${baseUrl}/cars`, { waitUntil: 'networkidle' })
    await page.getByLabel(/Search make/).fill('OF-103')
    await expect.poll(() => page.locator('tbody tr').count()).toBe(1)
    await page.getByRole('link', { name: 'OF-103' }).click()
    await page.getByRole('link', { name: 'Try settings' }).click()
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'Started from Road v1, on the car.' }).count()).toBe(1)
    expect(await page.locator('#param-powerCapKw').inputValue()).toBe('30') // OF-103's signed-off Road v1
    await page.getByRole('button', { name: 'Valet v1, on the car' }).click()
    await expect.poll(() => page.locator('#param-powerCapKw').inputValue()).toBe('15')
    await page.getByRole('button', { name: 'The Fenlow 45 defaults' }).click()
    await expect.poll(() => page.locator('#param-powerCapKw').inputValue()).toBe('40')
  })

  it('on a wide screen the results panel says while more of it lies below, until it is scrolled to its end', async () => {
    await page.goto(tryUrl, { waitUntil: 'networkidle' })
    const panel = page.getByRole('region', { name: 'What these settings do to this car' })
    const cue = page.locator('[data-more-below]')
    await expect.poll(() => cue.isVisible()).toBe(true)
    expect(await panel.evaluate(el => el.scrollHeight > el.clientHeight)).toBe(true) // it is taller than the window
    await panel.evaluate((el) => { el.scrollTop = el.scrollHeight })
    await expect.poll(() => cue.count()).toBe(0)
    await panel.evaluate((el) => { el.scrollTop = 0 })
    await expect.poll(() => cue.isVisible()).toBe(true)
  })

  it('works under the product\'s content security policy, which forbids eval', async () => {
    const strict = await context.newPage()
    await strict.addInitScript(() => {
      const seen: string[] = []
      ;(globalThis as unknown as { cspViolations: string[] }).cspViolations = seen
      document.addEventListener('securitypolicyviolation', e => seen.push(`${e.violatedDirective} ${e.blockedURI}`))
    })
    const response = await strict.goto(tryUrl, { waitUntil: 'networkidle' })
    const policy = response!.headers()['content-security-policy'] ?? ''
    expect(policy).toMatch(/script-src [^;]*'self'/)
    expect(policy).not.toContain('unsafe-eval')
    await expect.poll(() => strict.locator('#param-liftOffRegenPct').count()).toBe(1)
    await strict.locator('#param-liftOffRegenPct').fill('100')
    await expect.poll(() => rules(strict)).toContain('regen-grip-snow')
    await expect.poll(() => strict.locator('[data-chart] canvas').count()).toBe(4)
    expect(await strict.evaluate(() => (globalThis as unknown as { cspViolations: string[] }).cspViolations)).toEqual([])
    await strict.close()
  })
})
