import { describe, it, expect, afterAll } from 'vitest'
import type { Page } from 'playwright-core'
import { baseUrl, launch, signInThroughPage, shot, accessibilityProblems } from './helpers'
import { defaultSettings } from '../../shared/compute/settings'

// In the second workshop, so the demo workshop's thresholds that other tests rely on stay as seeded.
const box = (page: Page, name: string) => page.getByRole('spinbutton', { name: new RegExp(`^${name}`) })
const stored = async (page: Page) => (await (await page.request.get(`${baseUrl}/api/workshop`)).json()).settings
const save = (page: Page) => page.getByRole('button', { name: 'Save the thresholds' }).click()
// The save bar sticks to the window's foot; at the page's end it sits in its place for a whole-page picture.
async function shotAtEnd(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, document.body.scrollHeight))
  await shot(page, name)
}

describe('an admin sets the workshop\'s safety thresholds', async () => {
  const { context, page } = await launch()
  let original: unknown
  afterAll(async () => {
    if (original) await page.request.patch(`${baseUrl}/api/workshop/settings`, { data: original })
    await context.close()
  })

  it('changes snow friction and the creep-hold gradient, saves, sees them after a reload and in the history', async () => {
    await signInThroughPage(page, 'admin@second.voltwright.test')
    original = await stored(page)
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Safety thresholds' }).click()
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Safety thresholds')
    expect(await page.getByRole('heading', { name: /These thresholds decide when Voltwright warns about a car/ }).count()).toBe(1)
    await expect.poll(() => box(page, 'Snow friction').inputValue()).toBe('0.2')
    expect(await page.locator('[data-setting="friction.snow"]').textContent()).toContain('Allowed 0.05 to 0.5 · default 0.2')
    expect(await box(page, 'Regen grip caution share').inputValue()).toBe('80') // 0.8 of the grip, shown as a percentage
    await box(page, 'Snow friction').fill('0.15')
    await box(page, 'Minimum creep-hold gradient').fill('8')
    expect(await page.locator('[data-unsaved-count]').textContent()).toBe('2 changes not saved yet')
    expect(await page.locator('[data-setting="friction.snow"] [data-unsaved]').textContent()).toContain('saved: 0.2')
    await shotAtEnd(page, 'workshop-settings-01-edited')
    expect(await accessibilityProblems(page)).toEqual([])

    await save(page)
    await expect.poll(() => page.locator('[data-saved]').textContent()).toContain('Saved 2 changes')
    const saved = await page.locator('[data-saved]').textContent()
    expect(saved).toContain('Snow friction: 0.2 → 0.15')
    expect(saved).toContain('Minimum creep-hold gradient: 5 % → 8 %')
    expect(saved).toContain('Recorded in the workshop\'s history')
    await shotAtEnd(page, 'workshop-settings-02-saved')

    await page.reload({ waitUntil: 'networkidle' })
    await expect.poll(() => box(page, 'Snow friction').inputValue()).toBe('0.15')
    expect(await box(page, 'Minimum creep-hold gradient').inputValue()).toBe('8')
    expect(await page.locator('[data-unsaved-count]').textContent()).toBe('Everything shown is saved')

    await page.getByRole('link', { name: 'Activity', exact: true }).last().click()
    const event = page.locator('li', { hasText: 'changed the workshop\'s settings' }).first()
    await expect.poll(() => event.textContent()).toContain('Juno Hatherley')
    expect(await event.locator('tr', { hasText: 'Snow friction' }).textContent()).toMatch(/0\.2\s*→\s*0\.15/)
    expect(await event.locator('tr', { hasText: 'Minimum creep-hold gradient' }).textContent()).toMatch(/5 %\s*→\s*8 %/)
  })

  it('refuses out-of-range values by name, and shows the server\'s word when another admin saved meanwhile', async () => {
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Safety thresholds' }).click()
    await box(page, 'Snow friction').fill('0.6')
    await box(page, 'Regen grip caution share').fill('100')
    await save(page)
    await expect.poll(() => page.locator('#setting-friction-snow-error').textContent()).toBe('Snow friction must be from 0.05 to 0.5')
    expect(await box(page, 'Snow friction').getAttribute('aria-invalid')).toBe('true')
    expect(await page.locator('#setting-regenGripCautionFraction-error').textContent()).toContain('Regen grip caution share must be above 0 % and below 100 %')
    expect(await page.getByText('Nothing was saved: some values need a look').count()).toBe(1)
    await shotAtEnd(page, 'workshop-settings-03-refused')
    expect(await accessibilityProblems(page)).toEqual([])
    expect((await stored(page)).friction.snow).toBe(0.15)

    // Another admin lowers dry friction behind this form's back; the wet value typed here is now above it.
    expect((await page.request.patch(`${baseUrl}/api/workshop/settings`, { data: { friction: { dry: 0.6 } } })).status()).toBe(200)
    await box(page, 'Snow friction').fill('0.15')
    await box(page, 'Regen grip caution share').fill('80')
    await box(page, 'Wet-road friction').fill('0.65')
    await save(page)
    await expect.poll(() => page.locator('[data-group="friction"] [role="alert"]').textContent()).toBe('Friction must not rise from dry to wet to snow')
    await expect.poll(() => page.locator('[data-setting="friction.dry"] [data-unsaved]').textContent()).toContain('saved: 0.6')
    expect((await stored(page)).friction).toEqual({ dry: 0.6, wet: 0.5, snow: 0.15 })
  })

  it('puts a field, then every field, back to its default, storing nothing until the admin saves', async () => {
    await page.reload({ waitUntil: 'networkidle' })
    await expect.poll(() => box(page, 'Snow friction').inputValue()).toBe('0.15')
    await page.getByRole('button', { name: 'Back to the default for Snow friction' }).click()
    expect(await box(page, 'Snow friction').inputValue()).toBe('0.2')
    expect(await page.locator('[data-setting="friction.snow"] [data-unsaved]').textContent()).toContain('saved: 0.15')
    await page.reload({ waitUntil: 'networkidle' })
    await expect.poll(() => box(page, 'Snow friction').inputValue()).toBe('0.15')

    await page.getByRole('button', { name: 'Back to all the defaults' }).click()
    expect(await box(page, 'Dry-road friction').inputValue()).toBe('0.8')
    expect(await box(page, 'Minimum creep-hold gradient').inputValue()).toBe('5')
    expect(await page.locator('[data-unsaved-count]').textContent()).toBe('3 changes not saved yet')
    expect((await stored(page)).friction.dry).toBe(0.6)
    await save(page)
    await expect.poll(() => page.locator('[data-saved]').textContent()).toContain('Saved 3 changes')
    expect(await stored(page)).toEqual(defaultSettings)
  })

  it('is not for a tuner: no link, and the screen refuses', async () => {
    const tuner = await launch()
    try {
      await signInThroughPage(tuner.page, 'tuner@second.voltwright.test')
      expect(await tuner.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Safety thresholds' }).count()).toBe(0)
      const res = await tuner.page.goto(`${baseUrl}/admin/workshop`, { waitUntil: 'networkidle' })
      expect(res?.status()).toBe(403)
      expect(await tuner.page.getByRole('heading', { level: 1 }).textContent()).toBe('Not part of your role')
      expect(await tuner.page.getByRole('navigation', { name: 'Main' }).count()).toBe(1) // in the product's own frame, with a way back
      expect(await accessibilityProblems(tuner.page)).toEqual([])
      expect(await tuner.page.getByRole('button', { name: 'Save the thresholds' }).count()).toBe(0)
      await shot(tuner.page, 'workshop-settings-04-tuner-refused')
      await tuner.page.getByRole('button', { name: 'Back to the bench' }).click()
      await tuner.page.waitForURL(u => u.pathname === '/')
      expect((await tuner.page.request.patch(`${baseUrl}/api/workshop/settings`, { data: { friction: { snow: 0.1 } } })).status()).toBe(403)
    } finally { await tuner.context.close() }
  })
})
