import { describe, it, expect, afterAll } from 'vitest'
import type { Page } from 'playwright-core'
import { launch, baseUrl, shot, signInByApi } from './helpers'
import { tickReady } from './steps'
import { useRunningServer, signIn } from '../api/helpers'
import { newCar } from '../api/road-test-fixtures'
import { internalNameIn } from '../unit/internal-names'

// What each of the workshop's people opens in a day; the car and version are made here, with a long unbroken rationale,
// beside a demo car with every part filled in (OF-103: two profiles signed off, road tests, snags, a read-back).
const tabs = ['versions', 'road-tests', 'snags', 'readbacks', 'history']
interface Ids { carId: number, versionId: number, ownCarId: number, demoId: number, kitId: number, roadTestId: number }
function pagesFor({ carId, versionId, ownCarId, demoId, kitId, roadTestId }: Ids): Record<string, string[]> {
  return {
    'tuner@voltwright.test': ['/', '/cars', `/cars/${carId}`, `/versions/${versionId}`, '/snags', `/cars/${demoId}/versions`, `/cars/${demoId}/handover`, '/kits', `/kits/${kitId}`],
    'engineer@voltwright.test': ['/', '/activity', `/cars/${carId}`, `/versions/${versionId}`, `/cars/${demoId}`, `/cars/${demoId}/history`],
    'tester@voltwright.test': ['/', '/cars', `/cars/${carId}`, ...tabs.map(t => `/cars/${carId}/${t}`), ...tabs.map(t => `/cars/${demoId}/${t}`), '/snags', `/road-tests/${roadTestId}`],
    'auditor@voltwright.test': ['/', '/activity', `/cars/${carId}`, `/cars/${carId}/history`],
    'admin@voltwright.test': ['/', '/admin/people', '/admin/workshop', '/admin/platforms', '/activity'],
    'client@voltwright.test': ['/', `/my-cars/${ownCarId}`]
  }
}

const sideways = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)
// A table meant to stack on a phone that still needs its own sideways scroll (columns out of sight).
const overflowingTables = (page: Page) => page.locator('table.stack').evaluateAll(tables => tables
  .filter(t => t.scrollWidth > (t.parentElement?.clientWidth ?? 0) + 1).map(t => t.querySelector('caption')?.textContent ?? t.outerHTML.slice(0, 60)))
// The page as read, each piece of text on its own (innerText runs side-by-side boxes together, "testingKJX"),
// leaving out what is not rendered, such as the closed "for auditors" parts.
const pageText = (page: Page) => page.evaluate(() => {
  const root = document.querySelector('main') ?? document.body
  const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT)
  const parts: string[] = []
  for (let n = walker.nextNode(); n; n = walker.nextNode()) {
    const el = n.parentElement
    if (el && el.checkVisibility() && !el.closest('details:not([open]) > :not(summary)')) parts.push(n.textContent ?? '')
  }
  return parts.join(' ')
})

// The history as a person reads it: each event with the part for auditors folded away.
const historyText = (page: Page) => page.locator('main ol > li').evaluateAll((items) => {
  document.querySelectorAll('main details').forEach((d) => { (d as HTMLDetailsElement).open = false })
  return items.map(li => (li as HTMLElement).innerText).join('\n')
})

describe('every main page fits the screen, as each of its people sees it', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const car = await newCar(tuner, { model: 'Wide Value Saloon' })
  const rationale = 'x'.repeat(4000) // a pasted value with nowhere to break
  const created = await tuner.call('POST', `/api/vehicles/${car.id}/profiles`, { name: 'Road', rationale })
  expect(created.status).toBe(201)
  const client = await signIn('client@voltwright.test')
  const ownCarId = (await client.call('GET', '/api/vehicles')).body.items[0].id as number
  const demoId = (await tuner.call('GET', '/api/vehicles?q=OF-103')).body.items[0].id as number
  const kitId = (await tuner.call('GET', '/api/kits')).body.items[0].id as number
  const roadTestId = (await tuner.call('GET', `/api/vehicles/${demoId}/road-tests`)).body.items[0].id as number
  const pages = pagesFor({ carId: car.id, versionId: created.body.id, ownCarId, demoId, kitId, roadTestId })
  const checkKeys = ((await (await signIn('admin@voltwright.test')).call('GET', '/api/workshop/checks')).body.items as { key: string }[]).map(c => c.key)

  for (const width of [390, 1280]) {
    describe(`at ${width} px`, async () => {
      const { context, page } = await launch(width)
      afterAll(() => context.close())

      it.each(Object.keys(pages))('%s: no page scrolls sideways, no list hides columns on a phone, no page shows an internal name', async (email) => {
        await context.clearCookies()
        const login = await signInByApi(page, email)
        expect(login.ok()).toBe(true)
        const wide: string[] = []
        const named: string[] = []
        for (const path of pages[email]!) {
          await page.goto(`${baseUrl}${path}`, { waitUntil: 'networkidle' })
          const extra = await sideways(page)
          if (extra > 0) wide.push(`${path}: ${extra} px too wide`)
          if (width < 640) wide.push(...(await overflowingTables(page)).map(t => `${path}: the table "${t}" scrolls sideways`))
          const name = internalNameIn(await pageText(page), [], { shortCodes: path !== '/admin/platforms' })
          if (name) named.push(`${path}: …${name}…`)
        }
        expect(wide).toEqual([])
        expect(named).toEqual([])
      })
    })
  }

  it('reads the history in words: no field names, no JSON, no long decimals', async () => {
    const { context, page } = await launch(1280)
    try {
      await signInByApi(page, 'auditor@voltwright.test')
      for (const path of ['/activity', `/cars/${car.id}/history`]) {
        await page.goto(`${baseUrl}${path}`, { waitUntil: 'networkidle' })
        await expect.poll(() => page.locator('main ol > li').count()).toBeGreaterThan(0)
        const text = await historyText(page)
        expect(text).toContain('drafted Road v1')
        expect(text.match(/\b(?!kWh?\b)[a-z]+[A-Z][A-Za-z]*\b/)?.[0], `a field name on ${path}`).toBeUndefined()
        expect(text.match(/.{0,20}[{[].{0,20}/)?.[0], `JSON on ${path}`).toBeUndefined()
        expect(text.match(/\d\.\d{5,}/)?.[0], `a long decimal on ${path}`).toBeUndefined()
        expect(text).not.toMatch(/[0-9a-f]{64}/)
        expect(internalNameIn(text, checkKeys), `a code on ${path}`).toBeUndefined()
      }
      // A kit and a workshop's own check, as the manager set them up, in words: cars and years, limits in their unit.
      for (const [label, words] of [['Kit created', '(1967–1978)'], ['Road-test check added', '13.2 V']] as const) {
        await page.goto(`${baseUrl}/activity`, { waitUntil: 'networkidle' })
        await page.getByLabel('What happened').selectOption({ label })
        await expect.poll(() => historyText(page), label).toContain(words)
        const text = await historyText(page)
        expect(text.match(/Spec template|Platform key|Kit name|version no\b|year (to|from)/i)?.[0], label).toBeUndefined()
        expect(internalNameIn(text, checkKeys), `a code under ${label}`).toBeUndefined()
      }
      await shot(page, 'screens-01-history-print')
    } finally {
      await context.close()
    }
  })

  it('says what is wrong with a road-test link, and why a photo is refused', async () => {
    const { context, page } = await launch(390)
    try {
      await signInByApi(page, 'tester@voltwright.test')
      for (const [path, words] of [['/road-tests/new', 'does not say which version'], ['/road-tests/new?versionId=abc', 'does not exist'], ['/road-tests/new?versionId=999999', 'Back to the bench']] as const) {
        await page.goto(`${baseUrl}${path}`, { waitUntil: 'networkidle' })
        await expect.poll(() => page.getByRole('alert').filter({ hasText: 'Nothing to road-test here' }).count(), path).toBe(1)
        expect(await page.getByRole('alert').textContent()).toContain(words)
      }
      await page.goto(`${baseUrl}/road-tests/new?version=${created.body.id}`, { waitUntil: 'networkidle' })
      await expect.poll(() => page.getByText(/not approved; the record cannot be saved/).count()).toBe(1)
      await tickReady(page)
      await page.getByRole('button', { name: 'Start the checks' }).click()
      await page.locator('input[type=file]').setInputFiles({ name: 'notes.txt', mimeType: 'text/plain', buffer: Buffer.from('not a photo') })
      await expect.poll(() => page.getByRole('alert').filter({ hasText: 'notes.txt was not added: only JPEG, PNG or WebP photos' }).count()).toBe(1)
      await shot(page, 'screens-02-photo-refused')
    } finally {
      await context.close()
    }
  })

  it('opens a car on an overview that fits two screens, each part a tab of its own reachable by URL', async () => {
    const { context, page } = await launch(1280)
    try {
      await signInByApi(page, 'tuner@voltwright.test')
      const demo = (await tuner.call('GET', '/api/vehicles?q=OF-104')).body.items[0] as { id: number }
      await page.goto(`${baseUrl}/cars/${demo.id}`, { waitUntil: 'networkidle' })
      await expect.poll(() => page.locator('[data-on-car]').count()).toBeGreaterThan(0)
      expect(await page.evaluate(() => document.documentElement.scrollHeight)).toBeLessThanOrEqual(2 * 900)
      await shot(page, 'screens-03-car-overview')
      const nav = page.getByRole('navigation', { name: 'The car\'s pages' })
      for (const [label, path, heading] of [['Settings and versions', 'versions', /profiles/i], ['Road tests', 'road-tests', /Road tests/], ['Snags', 'snags', /Snag list/], ['Read-backs', 'readbacks', /read-back/i], ['History', 'history', /History/]] as const) {
        await nav.getByRole('link', { name: label }).click()
        await page.waitForURL(u => u.pathname === `/cars/${demo.id}/${path}`)
        await expect.poll(() => page.getByRole('heading', { level: 2, name: heading }).count(), label).toBeGreaterThan(0)
        expect(await nav.getByRole('link', { name: label }).getAttribute('aria-current')).toBe('page')
      }
    } finally {
      await context.close()
    }
  })
})
