import { describe, it, expect } from 'vitest'
import type { Page } from 'playwright-core'
import { launch, baseUrl, shot, signInByApi } from './helpers'
import { useRunningServer, signIn } from '../api/helpers'

// What shows of a page with the parts folded away for auditors closed.
const mainText = (page: Page) => page.locator('main').evaluate((main) => {
  main.querySelectorAll('details').forEach((d) => { (d as HTMLDetailsElement).open = false })
  return (main as HTMLElement).innerText
})
const HASH = /[0-9a-f]{64}/

describe('a refusal in its person\'s words, and the hashes kept for the auditors', async () => {
  await useRunningServer()
  const auditor = await signIn('auditor@voltwright.test')
  const carOf = async (ref: string) => (await auditor.call('GET', `/api/vehicles?q=${ref}`)).body.items[0].id as number
  const [handedOver, drifted] = [await carOf('OF-103'), await carOf('OF-104')]
  const roadTestOf = async (carId: number) => (await auditor.call('GET', `/api/vehicles/${carId}/road-tests`)).body.items.at(-1).id as number
  const [frontDriven, wetTest] = [await roadTestOf(handedOver), await roadTestOf(drifted)]

  it('turns a car\'s owner back to their cars from the workshop\'s pages, and says a car not theirs is not found', async () => {
    const { context, page } = await launch(390)
    try {
      await signInByApi(page, 'client@voltwright.test')
      for (const path of ['/activity', `/cars/${handedOver}/history/print`, `/road-tests/${frontDriven}`]) {
        await page.goto(`${baseUrl}${path}`, { waitUntil: 'networkidle' })
        await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent(), path).toBe('A page for the workshop')
        expect(await page.getByRole('button', { name: 'Back to my cars' }).count(), path).toBe(1)
        expect(await page.locator('main').innerText(), path).not.toMatch(/administrator|bench|could not be read/i)
      }
      await shot(page, 'refusals-01-owner')
      await page.goto(`${baseUrl}/cars/${drifted}/handover`, { waitUntil: 'networkidle' })
      await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Car not found')
      expect(await page.getByRole('link', { name: 'Back to the car', exact: true }).count()).toBe(0)
    } finally {
      await context.close()
    }
  })

  it('shows a road test\'s values as the trade writes them, and its record hash only to whoever opens the part for auditors', async () => {
    const { context, page } = await launch(1280)
    try {
      await signInByApi(page, 'auditor@voltwright.test')
      await page.goto(`${baseUrl}/road-tests/${wetTest}`, { waitUntil: 'networkidle' })
      await expect.poll(() => mainText(page)).toContain('Deceleration 0.80 m/s²')
      expect(await mainText(page)).not.toMatch(/if measured|[^\d]0\.5 m\/s²/)
      expect(await mainText(page)).not.toMatch(HASH)
      await page.getByText('For auditors').click()
      expect(await page.locator('main').innerText()).toMatch(HASH)
      await page.goto(`${baseUrl}/road-tests/${frontDriven}`, { waitUntil: 'networkidle' })
      await expect.poll(() => mainText(page)).toContain('Front-axle grip on this surface')
      // The owner's sheet: no hash among the people; a car whose controller drifted says so before anything else.
      await page.goto(`${baseUrl}/cars/${handedOver}/handover`, { waitUntil: 'networkidle' })
      await expect.poll(() => mainText(page)).toContain('Who proposed, approved and tested it')
      expect(await mainText(page)).not.toMatch(HASH)
      await page.goto(`${baseUrl}/cars/${drifted}/handover`, { waitUntil: 'networkidle' })
      await expect.poll(() => page.getByRole('alert').first().textContent()).toContain('do not rely on this sheet')
      await shot(page, 'refusals-02-drifted-handover')
    } finally {
      await context.close()
    }
  })
})
