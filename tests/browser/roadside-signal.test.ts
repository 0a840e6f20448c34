import { describe, it, expect, afterAll, afterEach } from 'vitest'
import type { Page } from 'playwright-core'
import sharp from 'sharp'
import { launch, baseUrl, shot, signInByApi } from './helpers'
import { passTheRest, recordConditions, recordHillStart, recordLiftOff } from './steps'
import { useRunningServer, signIn } from '../api/helpers'
import { approvedVersion, newCar, newProfile, PLATFORM } from '../api/road-test-fixtures'

const JS_BUDGET = 120 * 1024 // compressed JavaScript for the road-test page, as sent over the wire

const photo = async (name: string) => ({ name, mimeType: 'image/jpeg', buffer: await sharp({ create: { width: 64, height: 48, channels: 3, background: '#b87333' } }).jpeg().toBuffer() })

async function fillTheWizard(page: Page, photoName?: string) {
  await recordConditions(page, { surface: 'Wet', ambientC: '9', route: 'Quarry Lane, no signal at the top' })
  await recordHillStart(page, '16', '50')
  if (photoName) {
    await page.locator('input[type=file]').setInputFiles(await photo(photoName))
    await expect.poll(() => page.locator('[data-photos-unsent]').textContent()).toContain(`${photoName}`)
  }
  await recordLiftOff(page, 'gentle')
  await passTheRest(page)
}

// What the phone still keeps of road tests: the wizard's page in the worker's cache, drafts in localStorage,
// photos in IndexedDB.
const keptPage = (page: Page) => page.evaluate(async () => Boolean(await (await caches.open('voltwright-roadside-v1')).match(location.href)))
const keptDrafts = (page: Page, versionId: number) => page.evaluate(id => Object.keys(localStorage).filter(k => k.startsWith('voltwright:road-test:') && k.endsWith(`:${id}`)), versionId)
const keptPhotos = (page: Page, versionId: number) => page.evaluate(id => new Promise<number>((resolve, reject) => {
  const open = indexedDB.open('voltwright-road-tests')
  // Looking must not create the database: the product's store would then never be made in it.
  open.onupgradeneeded = () => open.transaction?.abort()
  open.onerror = () => (open.error?.name === 'AbortError' ? resolve(0) : reject(open.error))
  open.onsuccess = () => {
    const db = open.result
    if (!db.objectStoreNames.contains('photos')) return resolve(0)
    const all = db.transaction('photos').objectStore('photos').getAll()
    all.onsuccess = () => resolve((all.result as { versionId: number }[]).filter(p => p.versionId === id).length)
  }
}), versionId)

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
  const newest = (items: { id: number }[]) => Math.max(...items.map(t => t.id))
  const roadTests = async () => (await tester.call('GET', `/api/vehicles/${car.id}/road-tests`)).body.items as { id: number }[]

  it('loads the road-test page with less than 120 KiB of compressed JavaScript', async () => {
    const versionId = await approvedVersion(profileId)
    await signInByApi(page, 'tester@voltwright.test')
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
    await fillTheWizard(tab, 'hill-rollback.jpg')
    await expect.poll(() => keptPage(tab)).toBe(true)
    // A reload keeps the photo with the rest, still marked as not sent.
    await tab.reload({ waitUntil: 'networkidle' })
    await tab.getByRole('button', { name: 'Hill start' }).click()
    await expect.poll(() => tab.locator('[data-photos-unsent]').textContent()).toContain('hill-rollback.jpg')
    expect(await tab.locator('[data-photos-unsent]').textContent()).toContain('not sent yet, kept on this phone')
    await tab.getByRole('button', { name: /^Verdict, step/ }).click()
    // No signal: the phone knows it is offline, and nothing it sends reaches the server. (Playwright's offline
    // emulation alone let a send through in two runs on a loaded machine, so the network is cut as well.)
    await context.route(`${baseUrl}/api/**`, route => route.abort('internetdisconnected'))
    await context.setOffline(true)
    await tab.waitForFunction(() => !navigator.onLine)
    await tab.getByRole('button', { name: 'Save the road test' }).click()
    await expect.poll(() => tab.locator('[data-unsent]').textContent()).toContain('No connection: the road test is kept on this phone')
    expect(await tab.locator('[data-unsent]').textContent()).toContain('Its 1 photo will follow it')
    await shot(tab, 'roadside-01-not-sent')
    // With no signal a reload still opens the wizard, from the page and code the phone kept, with the record.
    const reloaded = await tab.reload({ waitUntil: 'load' })
    expect(reloaded?.headers()['x-voltwright-kept']).toBe('no signal')
    await expect.poll(() => tab.locator('[data-unsent]').textContent()).toContain('No connection: the road test is kept on this phone')
    await shot(tab, 'roadside-01b-reloaded-without-signal')
    await tab.close() // the tester gives up and closes the tab; the record waits on the phone
    expect((await roadTests()).length).toBe(before)
    await context.unroute(`${baseUrl}/api/**`)
    await context.setOffline(false)
    await page.goto(`${baseUrl}/road-tests/new?version=${versionId}`, { waitUntil: 'networkidle' })
    await page.waitForURL(u => /^\/road-tests\/\d+$/.test(u.pathname))
    const after = await roadTests()
    expect(after.length).toBe(before + 1)
    const recorded = (await tester.call('GET', `/api/road-tests/${newest(after)}`)).body as { photos: { filename: string, caption: string }[] }
    expect(recorded.photos.map(p => [p.filename, p.caption])).toEqual([['hill-rollback.jpg', 'Hill start']])
    expect(await keptDrafts(page, versionId)).toEqual([])
    expect(await keptPhotos(page, versionId)).toBe(0)
  })

  it('sends a kept photo once after the record, when the answer to its send is lost and the page reloaded', async () => {
    const versionId = await approvedVersion(profileId)
    await page.goto(`${baseUrl}/road-tests/new?version=${versionId}`, { waitUntil: 'networkidle' })
    await fillTheWizard(page, 'creep-hold.jpg')
    // The photo reaches the server but its answer does not reach the phone.
    let answerLost = () => {}
    const lost = new Promise<void>((resolve) => { answerLost = resolve })
    await page.route('**/api/road-tests/*/photos*', async (route) => {
      await route.fetch()
      await route.abort('internetdisconnected')
      answerLost()
    })
    await page.getByRole('button', { name: 'Save the road test' }).click()
    await lost
    await expect.poll(() => page.locator('[data-photos-waiting]').textContent()).toContain('The road test is recorded; 1 photo not sent yet')
    await expect.poll(() => page.getByRole('button', { name: 'Send the photos now' }).count()).toBe(1)
    await shot(page, 'roadside-03-photo-not-sent')
    const id = newest(await roadTests())
    const photos = async () => ((await tester.call('GET', `/api/road-tests/${id}`)).body as { photos: unknown[] }).photos.length
    await expect.poll(photos).toBe(1)
    expect(await keptPhotos(page, versionId)).toBe(1)
    await page.unroute('**/api/road-tests/*/photos*')
    await page.reload({ waitUntil: 'networkidle' })
    await page.waitForURL(u => u.pathname === `/road-tests/${id}`)
    expect(await photos()).toBe(1)
    expect(await keptPhotos(page, versionId)).toBe(0)
    expect(await keptDrafts(page, versionId)).toEqual([])
  })

  it('keeps one person\'s road test from the next person signed in on the same phone', async () => {
    const versionId = await approvedVersion(profileId)
    const shared = await launch(390)
    try {
      const signInAs = (email: string) => signInByApi(shared.page, email)
      await signInAs('tester@voltwright.test')
      await shared.page.goto(`${baseUrl}/road-tests/new?version=${versionId}`, { waitUntil: 'networkidle' })
      await recordConditions(shared.page, { surface: 'Wet', ambientC: '9', route: 'Left on the shared phone' })
      await expect.poll(() => keptDrafts(shared.page, versionId)).toHaveLength(1)
      await expect.poll(() => keptPage(shared.page)).toBe(true)
      await shared.page.getByRole('button', { name: 'Menu' }).click()
      await shared.page.getByRole('button', { name: 'Sign out' }).click()
      await shared.page.waitForURL(u => u.pathname === '/login')
      expect(await shared.page.evaluate(() => caches.keys())).toEqual([])
      await signInAs('lead@voltwright.test')
      await shared.page.goto(`${baseUrl}/road-tests/new?version=${versionId}`, { waitUntil: 'networkidle' })
      await expect.poll(() => shared.page.getByLabel('Route').count()).toBe(1)
      expect(await shared.page.getByLabel('Route').inputValue()).toBe('')
      expect(await shared.page.getByText('Carried on from what this phone kept.').count()).toBe(0)
    } finally {
      await shared.context.close()
    }
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
      await page.getByRole('button', { name: /^Workshop checks, step/ }).click()
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
      await page.getByRole('button', { name: /^Verdict, step/ }).click()
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
