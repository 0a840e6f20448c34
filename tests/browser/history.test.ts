import { describe, it, expect, afterAll } from 'vitest'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl } from './helpers'
import { verifyChain } from './steps'

describe('the history, as an auditor and as a car owner sees it', async () => {
  const { context, page } = await launch()
  afterAll(() => context.close())

  it('an auditor verifies the chain from the bench', async () => {
    await signInThroughPage(page, 'auditor@voltwright.test')
    await expect.poll(() => page.getByRole('heading', { name: 'The history chain' }).count()).toBe(1)
    await verifyChain(page)
    expect(await page.getByText(/events checked in/).textContent()).toMatch(/^\d[\d,]* events checked/)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'history-01-auditor-bench')
  })

  it('an auditor opens a car, reads its history and filters it', async () => {
    await page.getByRole('link', { name: 'Cars' }).first().click()
    await page.getByRole('link', { name: 'OF-101' }).click()
    const history = page.getByRole('region', { name: 'History' })
    await expect.poll(() => history.getByRole('listitem').count()).toBeGreaterThan(0)
    await expect.poll(() => history.getByText('Car booked in').count()).toBe(1)
    expect(await page.getByRole('button', { name: 'Record a read-back' }).count()).toBe(0)
    await history.getByLabel('What happened').selectOption({ label: 'Car booked in' })
    await expect.poll(() => history.locator('ol > li').count()).toBe(1)
    await history.getByLabel('To (day, included)').fill('2020-01-01')
    await history.getByLabel('To (day, included)').dispatchEvent('change')
    await expect.poll(() => history.getByText('No events match.').count()).toBe(1)
    await history.getByRole('button', { name: 'Clear the filters' }).click()
    await expect.poll(() => history.locator('ol > li').count()).toBeGreaterThan(0)
    const csv = await history.getByRole('link', { name: 'Download CSV' }).getAttribute('href')
    expect(csv).toMatch(/\/api\/vehicles\/\d+\/history\.csv$/)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'history-02-car-history')
    await history.getByRole('link', { name: 'Print view' }).click()
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('History of OF-101')
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'history-03-print-view')
  })

  it('a car owner sees their own car in plain words, and not another\'s', async () => {
    await page.getByRole('button', { name: 'Sign out' }).first().click()
    await signInThroughPage(page, 'client@voltwright.test')
    await expect.poll(() => page.getByRole('heading', { name: 'My cars' }).count()).toBe(1)
    expect(await page.getByRole('heading', { name: 'The history chain' }).count()).toBe(0)
    const mine = (await page.locator('a[href^="/my-cars/"]').evaluateAll(links => links.map(a => Number(a.getAttribute('href')!.split('/').pop()))))
    expect(mine).toHaveLength(2)
    const other = [1, 2, 3, 4, 5, 6].find(id => !mine.includes(id))!
    await page.getByRole('link', { name: /Tregarth Minim 850/ }).click()
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('Tregarth Minim 850')
    await expect.poll(() => page.getByRole('heading', { name: 'How the car is set up' }).count()).toBe(1)
    expect(await page.getByText(/power limited to \d+ kW \(\d+ hp\)/).count()).toBeGreaterThan(0)
    expect(await page.getByRole('link', { name: /handover sheet/ }).getAttribute('href')).toMatch(/\/api\/vehicles\/\d+\/handover\.pdf$/)
    expect(await page.getByText('History').count()).toBe(0)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'history-04-owner-car')
    await page.goto(`${baseUrl}/cars/${other}`, { waitUntil: 'networkidle' })
    await expect.poll(() => page.getByRole('alert').textContent()).toContain('not recorded in your name')
    expect(new URL(page.url()).pathname).toBe(`/my-cars/${other}`)
    await shot(page, 'history-05-owner-other-car')
  })
})
