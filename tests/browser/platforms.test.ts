import { describe, it, expect, afterAll } from 'vitest'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { launch, signInThroughPage, shot, accessibilityProblems } from './helpers'
import { marrick110 } from '../../shared/platforms'

const key = `heron-${Date.now().toString(36)}`

describe('an admin adds a drive unit', async () => {
  const { context, page } = await launch()
  afterAll(() => context.close())

  it('sees the drive units and the problems of a broken schema, with nothing stored', async () => {
    await signInThroughPage(page, 'admin@voltwright.test')
    await page.getByRole('link', { name: 'Drive units' }).click()
    await expect.poll(() => page.locator('[data-platform]').count()).toBeGreaterThanOrEqual(3)
    await page.getByLabel('Short code').fill(key)
    await page.getByLabel('Name').fill('Heron 90')
    await page.getByLabel(/Motor top speed/).fill('11500')
    await page.getByLabel('Schema (JSON)').fill('{ "type": "object"')
    await page.getByRole('button', { name: 'Check and store the drive unit' }).click()
    await expect.poll(() => page.locator('[data-problems]').textContent()).toContain('not valid JSON')
    // "required" must be an array (JSON Schema 2020-12 validation vocabulary, json-schema.org)
    await page.getByLabel('Schema (JSON)').fill(JSON.stringify({ $schema: 'https://json-schema.org/draft/2020-12/schema', type: 'object', properties: {}, required: 'powerCapKw' }))
    await page.getByRole('button', { name: 'Check and store the drive unit' }).click()
    await expect.poll(() => page.locator('[data-problems]').textContent()).toContain('Not valid JSON Schema 2020-12')
    expect(await page.locator('[data-problems]').textContent()).toContain('/properties: must list the drive unit\'s settings')
    expect(await page.locator(`[data-platform="${key}"]`).count()).toBe(0)
    await shot(page, 'platforms-01-broken-schema')
    expect(await accessibilityProblems(page)).toEqual([])
  })

  it('uploads a good schema from a file and sees it listed as the workshop\'s own', async () => {
    const file = join(mkdtempSync(join(tmpdir(), 'voltwright-schema-')), 'heron-90.json')
    writeFileSync(file, JSON.stringify(marrick110.schema, null, 2))
    await page.getByLabel('Schema file').setInputFiles(file)
    await expect.poll(() => page.getByLabel('Schema (JSON)').inputValue()).toContain('"powerCapKw"')
    await page.getByRole('button', { name: 'Check and store the drive unit' }).click()
    await expect.poll(() => page.locator(`[data-platform="${key}"]`).textContent()).toContain('This workshop')
    expect(await page.getByRole('status').textContent()).toContain('Heron 90 is stored')
    expect(await page.locator('[data-problems]').count()).toBe(0)
    await shot(page, 'platforms-02-stored')
  })
})
