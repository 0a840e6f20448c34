import { describe, it, expect, afterAll, afterEach } from 'vitest'
import type { Page } from 'playwright-core'
import { launch, baseUrl, shot } from './helpers'
import { passTheRest, recordConditions, recordHillStart, recordLiftOff } from './steps'
import { useRunningServer, signIn, DEMO_PASSWORD } from '../api/helpers'
import { approvedVersion, newCar, newProfile, PLATFORM } from '../api/road-test-fixtures'

const JS_BUDGET = 120 * 1024 // compressed JavaScript for the road-test page, as sent over the wire

async function fillTheWizard(page: Page) {
  await recordConditions(page, { surface: 'Wet', ambientC: '9', route: 'Quarry Lane, no signal at the top' })
  await recordHillStart(page, '16', '50')
  await recordLiftOff(page, 'gentle')
  await passTheRest(page)
}

describe('the road test at the roadside, with little or no signal', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const car = await newCar(tuner, { model: 'No Signal Saloon' })
  const profileId = await newProfile(car.id)
  const { context, page } = await launch(390)
  afterAll(() => context.close())
  // A test that stops half-way must not leave the next one without signal.
  afterEach(async () => {
    await context.unrouteAll()
    await context.setOffline(false)
  })
  const roadTests = async () => (await tester.call('GET', `/api/vehicles/${car.id}/road-tests`)).body.items as { id: number }[]

  it('loads the road-test page with less than 120 KiB of compressed JavaScript', async () => {
    const versionId = await approvedVersion(profileId)
    await page.request.post(`${baseUrl}/api/auth/login`, { data: { email: 'tester@voltwright.test', password: DEMO_PASSWORD }, headers: { origin: baseUrl } })
    const sizes: Promise<number>[] = []
    const onFinished = (req: import('playwright-core').Request) => {
      if (req.resourceType() === 'script') sizes.push(req.sizes().then(s => s.responseBodySize))
    }
    const plain: string[] = [] // scripts sent without compression
    const onResponse = (r: import('playwright-core').Response) => {
      // Files under 1 KiB are not worth compressing and are sent as they are.
      const size = Number(r.headers()['content-length'] ?? 0)
      if (r.request().resourceType() === 'script' && size > 1024 && !/^(br|gzip)$/.test(r.headers()['content-encoding'] ?? '')) plain.push(r.url())
    }
    page.on('response', onResponse)
    page.on('requestfinished', onFinished)
    await page.goto(`${baseUrl}/road-tests/new?version=${versionId}`, { waitUntil: 'networkidle' })
    page.off('requestfinished', onFinished)
    page.off('response', onResponse)
    const bytes = (await Promise.all(sizes)).reduce((a, b) => a + b, 0)
    console.log(`road-test page: ${sizes.length} scripts, ${(bytes / 1024).toFixed(1)} KiB transferred`)
    expect(sizes.length).toBeGreaterThan(0)
    expect(bytes).toBeLessThan(JS_BUDGET)
    expect(plain).toEqual([])
  })

  it('keeps what was entered with no signal, through a closed tab, and sends it once the signal returns', async () => {
    const versionId = await approvedVersion(profileId)
    const before = (await roadTests()).length
    const tab = await context.newPage()
    await tab.goto(`${baseUrl}/road-tests/new?version=${versionId}`, { waitUntil: 'networkidle' })
    await fillTheWizard(tab)
    // No signal: the phone knows it is offline, and nothing it sends reaches the server. (Playwright's offline
    // emulation alone let a send through in two runs on a loaded machine, so the network is cut as well.)
    await context.route(`${baseUrl}/api/**`, route => route.abort('internetdisconnected'))
    await context.setOffline(true)
    await tab.waitForFunction(() => !navigator.onLine)
    await tab.getByRole('button', { name: 'Save the road test' }).click()
    await expect.poll(() => tab.locator('[data-unsent]').textContent()).toContain('No connection: the road test is kept on this phone')
    await shot(tab, 'roadside-01-not-sent')
    await tab.reload().catch(() => {}) // with no signal the page itself cannot load again
    await tab.close() // the tester gives up and closes the tab; the record waits on the phone
    expect((await roadTests()).length).toBe(before)
    await context.unroute(`${baseUrl}/api/**`)
    await context.setOffline(false)
    await page.goto(`${baseUrl}/road-tests/new?version=${versionId}`, { waitUntil: 'networkidle' })
    await page.waitForURL(u => /^\/road-tests\/\d+$/.test(u.pathname))
    expect((await roadTests()).length).toBe(before + 1)
    expect(await page.evaluate(id => localStorage.getItem(`voltwright:road-test:${id}`), versionId)).toBeNull()
  })

  it('records a road test once when the answer to a send is lost and the send is repeated', async () => {
    const versionId = await approvedVersion(profileId)
    const before = (await roadTests()).length
    await page.goto(`${baseUrl}/road-tests/new?version=${versionId}`, { waitUntil: 'networkidle' })
    await fillTheWizard(page)
    // The server records it, but the answer never reaches the phone.
    await page.route('**/api/versions/*/road-tests', async (route) => {
      await route.fetch()
      await route.abort('internetdisconnected')
    })
    await page.getByRole('button', { name: 'Save the road test' }).click()
    await expect.poll(async () => (await roadTests()).length).toBe(before + 1)
    await expect.poll(() => page.locator('[data-unsent]').count()).toBe(1)
    await page.unroute('**/api/versions/*/road-tests')
    await page.reload({ waitUntil: 'networkidle' })
    await page.waitForURL(u => /^\/road-tests\/\d+$/.test(u.pathname))
    expect((await roadTests()).length).toBe(before + 1)
    await shot(page, 'roadside-02-sent-once')
  })

  it('keeps the workshop\'s own checks on the phone too: a reload loses neither a verdict, a value nor a note', async () => {
    const admin = await signIn('admin@voltwright.test')
    const horn = (await admin.call('POST', '/api/workshop/checks', { label: 'Horn sounds clearly', record: 'pass-fail', platformKeys: [PLATFORM] })).body
    const volts = (await admin.call('POST', '/api/workshop/checks', { label: '12 V supply at idle', record: 'number', unit: 'V', min: 13.2, max: 14.8, platformKeys: [PLATFORM] })).body
    try {
      const versionId = await approvedVersion(profileId)
      await page.goto(`${baseUrl}/road-tests/new?version=${versionId}`, { waitUntil: 'networkidle' })
      await fillTheWizard(page)
      await page.getByRole('button', { name: 'Workshop checks', exact: true }).click()
      const hornBlock = page.locator(`[data-extra-check="${horn.key}"]`)
      await hornBlock.locator('label', { has: page.getByRole('radio', { name: 'Fail', exact: true }) }).click()
      await hornBlock.getByLabel('Note').fill('Weak, one of two horns silent')
      await page.locator(`#rt-extra-${volts.key}-value`).fill('13.7')
      await page.reload({ waitUntil: 'networkidle' })
      await expect.poll(() => page.getByRole('heading', { name: 'The workshop\'s own checks' }).count()).toBe(1)
      expect(await hornBlock.getByRole('radio', { name: 'Fail', exact: true }).isChecked()).toBe(true)
      expect(await hornBlock.getByLabel('Note').inputValue()).toBe('Weak, one of two horns silent')
      expect(await page.locator(`#rt-extra-${volts.key}-value`).inputValue()).toBe('13.7')
      await shot(page, 'roadside-03-workshop-checks-kept')
      await page.getByRole('button', { name: 'Verdict', exact: true }).click()
      await page.locator('label', { has: page.getByRole('radio', { name: 'Fail', exact: true }) }).click()
      await page.getByRole('button', { name: 'Save the road test' }).click()
      await page.waitForURL(u => /^\/road-tests\/\d+$/.test(u.pathname))
      const saved = (await tester.call('GET', `/api/road-tests/${page.url().split('/').pop()}`)).body
      expect(saved.checks.find((c: { key: string }) => c.key === horn.key)).toMatchObject({ verdict: 'fail', note: 'Weak, one of two horns silent' })
      expect(saved.checks.find((c: { key: string }) => c.key === volts.key)).toMatchObject({ verdict: 'pass', values: { value: 13.7 } })
    } finally {
      for (const c of [horn, volts]) await admin.call('PATCH', `/api/workshop/checks/${c.key}`, { retired: true })
    }
  })
})
