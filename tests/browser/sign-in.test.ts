import { describe, it, expect, afterAll } from 'vitest'
import { launch, signInThroughPage, shot, accessibilityProblems, baseUrl } from './helpers'

describe('signing in and opening a car', async () => {
  const { context, page } = await launch()
  afterAll(() => context.close())

  it('refuses a wrong password with one plain message', async () => {
    await page.goto(`${baseUrl}/login`, { waitUntil: 'networkidle' })
    await shot(page, 'sign-in-01-page')
    expect(await accessibilityProblems(page)).toEqual([])
    await page.getByLabel('E-mail').fill('tuner@voltwright.test')
    await page.getByLabel('Password').fill('not-my-password')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await expect.poll(() => page.getByRole('alert').textContent()).toContain('do not match')
  })

  it('a tuner signs in, finds a car in the list and opens its page', async () => {
    await signInThroughPage(page, 'tuner@voltwright.test')
    await expect.poll(() => page.getByRole('heading', { name: 'Bench' }).count()).toBe(1)
    await shot(page, 'sign-in-02-bench')
    await page.getByRole('link', { name: 'Cars' }).first().click()
    await page.getByLabel(/Search make/).fill('Marten')
    await expect.poll(() => page.locator('tbody tr').count()).toBe(1)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'sign-in-03-cars')
    await page.getByRole('link', { name: 'OF-101' }).click()
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('Penhallow Marten Roadster')
    await expect.poll(() => page.getByText('Kerb mass (converted)').count()).toBe(1)
    expect(await accessibilityProblems(page)).toEqual([])
    await shot(page, 'sign-in-04-car')
  })

  it('shows a wrong value beside its field on the car\'s edit form', async () => {
    await page.getByRole('button', { name: 'Edit the car\'s facts' }).click()
    await page.getByLabel(/Kerb mass/).fill('-20')
    await page.getByRole('button', { name: 'Save the car\'s facts' }).click()
    await expect.poll(() => page.locator('#spec-kerbMassKg-error').textContent()).toContain('above zero')
    await shot(page, 'sign-in-05-edit-error')
  })
})
