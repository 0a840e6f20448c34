import { describe, it, expect, afterAll } from 'vitest'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl } from './helpers'

// Kits, a car booked in from one, a car following its kit's newer baseline, the fleet re-check and search.
describe('the workshop\'s fleet', async () => {
  const tuner = await launch()
  const engineer = await launch(390)
  afterAll(async () => { await tuner.context.close(); await engineer.context.close() })
  const stockRef = `K${Date.now().toString(36)}`.slice(0, 12).toUpperCase()

  it('lists the kits, and a kit\'s page shows its baseline versions and which cars are behind', async () => {
    const page = tuner.page
    await signInThroughPage(page, 'tuner@voltwright.test')
    await page.getByRole('link', { name: 'Kits' }).first().click()
    await page.getByRole('link', { name: 'Forge RD-45 small rear-drive' }).click()
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Forge RD-45 small rear-drive')
    expect(await page.locator('[data-version]').count()).toBe(2)
    expect(await page.locator('[data-car="OF-107"]').textContent()).toContain('On an older baseline')
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'fleet-01-kit')
  })

  it('books a car in from the kit, with the kit\'s typical facts filled in and the first draft on its baseline', async () => {
    const page = tuner.page
    await page.getByRole('link', { name: 'Book a car in from this kit' }).click()
    await page.waitForURL(/\/cars\/new\?kit=\d+/)
    await expect.poll(() => page.locator('#spec-kerbMassKg').inputValue()).toBe('930')
    await page.locator('#stockRef').fill(stockRef)
    await page.locator('#make').fill('Penhallow')
    await page.locator('#model').fill('Kestrel Roadster')
    await page.locator('#year').fill('1966')
    await page.locator('#spec-kerbMassKg').fill('940')
    await page.getByRole('button', { name: 'Book in the car' }).click()
    await page.waitForURL(/\/cars\/\d+$/)
    // The overview says in a line that the car stands on its kit's latest baseline.
    await expect.poll(() => page.locator('[data-kit-baseline]').textContent()).toContain('on the Forge RD-45 small rear-drive kit\'s latest baseline (version 2)')
    // The kit and its baseline are shown with the car's profiles, on the settings and versions tab.
    await page.getByRole('link', { name: 'Settings and versions' }).click()
    await expect.poll(() => page.locator('[data-baseline-of]').textContent()).toContain('Built from the Forge RD-45 small rear-drive kit, on its baseline version 2')
    expect(await page.locator('[data-baseline-of]').textContent()).toContain('This car\'s settings are the baseline\'s')
  })

  it('shows a car that its kit\'s baseline moved, and moves it onto the new baseline keeping its own settings', async () => {
    const page = tuner.page
    await page.goto(`${baseUrl}/cars`, { waitUntil: 'networkidle' })
    await page.getByRole('link', { name: 'OF-107' }).click()
    // The overview says the baseline moved and leads to the versions tab, where the move is offered.
    await expect.poll(() => page.locator('[data-kit-baseline]').textContent()).toContain('kit\'s baseline moved to version 2; this car stands on version 1')
    await page.getByRole('link', { name: 'See what changed and move onto it' }).click()
    await page.waitForURL(/\/cars\/\d+\/versions$/)
    await expect.poll(() => page.locator('[data-baseline-of]').textContent()).toContain('The kit\'s baseline moved: version 2 is approved.')
    await page.getByRole('button', { name: /Show the departures/ }).click()
    await expect.poll(() => page.getByRole('region', { name: /Where this car departs from the baseline/ }).textContent()).toContain('Power cap')
    await page.getByRole('button', { name: /Show what changed and move onto it/ }).click()
    await expect.poll(() => page.getByRole('region', { name: /What changed in the kit's baseline/ }).textContent()).toContain('Lift-off regen')
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'fleet-02-baseline-moved')
    await page.getByRole('button', { name: 'Start a new version on baseline v2' }).click()
    await page.waitForURL(/\/versions\/\d+$/)
    await expect.poll(() => page.locator('#param-liftOffRegenPct').inputValue()).toBe('20')
    expect(await page.locator('#param-powerCapKw').inputValue()).toBe('40')
  })

  it('an engineer re-checks every car on a phone and sees the result', async () => {
    const page = engineer.page
    await signInThroughPage(page, 'engineer@voltwright.test')
    await page.goto(`${baseUrl}/fleet`, { waitUntil: 'networkidle' })
    await page.getByRole('button', { name: 'Re-check every car now' }).click()
    await expect.poll(() => page.getByRole('status').first().textContent(), { timeout: 30000 }).toMatch(/cars checked, finished/)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'fleet-03-recheck')
  })

  it('searches the fleet with a form of conditions kept in the address', async () => {
    const page = engineer.page
    await page.getByRole('link', { name: 'Search the fleet' }).click()
    await page.getByRole('button', { name: /Rear-driven cars whose lift-off braking exceeds the snow grip/ }).click()
    await page.waitForURL(/c=spec\.drivenAxle~eq~rear/)
    await expect.poll(() => page.getByRole('heading', { name: /Cars found/ }).textContent()).toMatch(/Cars found \(\d+\)/)
    await page.reload({ waitUntil: 'networkidle' })
    expect(await page.locator('#cond-1-field').inputValue()).toBe('figure.liftOffOverSnowGripMs2')
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'fleet-04-search')
  })

  it('searches by a setting of one drive unit, picking the unit and the setting by name', async () => {
    const page = engineer.page
    await page.goto(`${baseUrl}/fleet/search`, { waitUntil: 'networkidle' })
    await page.getByRole('button', { name: 'Add a condition' }).click()
    await page.locator('#cond-0-field').selectOption({ label: 'A setting of one drive unit, by its name' })
    await page.locator('#cond-0-unit').selectOption({ label: 'Fenlow 45' })
    await page.locator('#cond-0-setting').selectOption({ label: 'Lift-off regen (%)' })
    await page.locator('#cond-0-op').selectOption({ label: 'at least' })
    await page.locator('#cond-0-value').fill('0')
    await page.locator('#cond-0-value').blur()
    await page.getByRole('button', { name: 'Search', exact: true }).click()
    await page.waitForURL(/c=unit\.fenlow-45\.liftOffRegenPct~ge~0/)
    await expect.poll(() => page.getByRole('columnheader', { name: 'Lift-off regen on the Fenlow 45 (%)' }).count()).toBe(1)
    await expect.poll(() => page.locator('tbody tr').count()).toBeGreaterThan(0)
    for (const cell of await page.locator('tbody tr td:nth-child(2)').allTextContents()) expect(cell).toBe('Fenlow 45')
    await page.reload({ waitUntil: 'networkidle' })
    expect(await page.locator('#cond-0-unit').inputValue()).toBe('fenlow-45')
    expect(await page.locator('#cond-0-setting').inputValue()).toBe('liftOffRegenPct')
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'fleet-05-search-one-unit')
  })
})
