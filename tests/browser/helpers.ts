// A real Chromium (Debian's, driven by playwright-core) against the server `npm test` started.
import { mkdtempSync, mkdirSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { createRequire } from 'node:module'
import { chromium, type BrowserContext, type Page } from 'playwright-core'
import { syntheticDrive, telemetryCsv, type SyntheticCar, type SyntheticOptions } from '../../shared/telemetry/synthetic'
import { DEMO_PASSWORD } from '../api/helpers'

export const baseUrl = process.env.VOLTWRIGHT_BASE_URL ?? 'http://localhost:3100'
export const artifacts = resolve(import.meta.dirname, '..', 'artifacts')
const axePath = createRequire(import.meta.url).resolve('axe-core/axe.min.js')

export async function launch(width = 1280): Promise<{ context: BrowserContext, page: Page }> {
  const context = await chromium.launchPersistentContext(mkdtempSync(join(tmpdir(), 'voltwright-browser-')), {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: { width, height: 900 },
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync']
  })
  const page = context.pages()[0] ?? await context.newPage()
  return { context, page }
}

export async function signInThroughPage(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${baseUrl}/login`, { waitUntil: 'networkidle' })
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(u => !u.pathname.startsWith('/login'))
}

// Signs the page's browser in through the API alone, a step quicker than the form where the form is not under test.
export async function signInByApi(page: Page, email: string, password = DEMO_PASSWORD) {
  return page.request.post(`${baseUrl}/api/auth/login`, { data: { email, password }, headers: { origin: baseUrl } })
}

export async function shot(page: Page, name: string) {
  mkdirSync(artifacts, { recursive: true })
  await page.screenshot({ path: join(artifacts, `${name}.png`), fullPage: true })
}

// Serious and critical WCAG 2 A/AA findings on the page, by rule id.
export async function accessibilityProblems(page: Page): Promise<string[]> {
  await page.addScriptTag({ path: axePath })
  const result = await page.evaluate(() => (globalThis as any).axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] } }))
  return result.violations.filter((v: any) => v.impact === 'serious' || v.impact === 'critical').map((v: any) => `${v.id}: ${v.nodes.map((n: any) => n.target.join(' ')).slice(0, 3).join(', ')}`)
}

// A synthetic controller log of one drive, written to a file for the upload field.
export function telemetryFile(name: string, car: SyntheticCar, options: SyntheticOptions = {}): string {
  const file = join(mkdtempSync(join(tmpdir(), 'voltwright-log-')), name)
  writeFileSync(file, telemetryCsv(syntheticDrive(car, options)))
  return file
}
