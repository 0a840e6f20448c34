import { execFileSync } from 'node:child_process'
import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, baseUrl, withDatabase } from './helpers'
import { pdfText } from './pdf'
import { approvedVersion, newCar, newClient, newProfile, recordRoadTest } from './road-test-fixtures'

const fonts = (pdf: Buffer) => execFileSync('pdffonts', ['-'], { input: pdf, encoding: 'utf8' })

describe('handover sheet', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const owner = await newClient(await signIn('admin@voltwright.test'))
  const client = await signIn(owner.email, 'owner-password-123')
  const clientId = owner.id
  const car = await newCar(tuner, { ownerUserId: clientId, make: 'Łowicz', model: 'Coupé Särkkä' })
  const profileId = await newProfile(car.id)
  const versionId = await approvedVersion(profileId, { parameters: { powerCapKw: 80, liftOffRegenPct: 20 } })
  const roadTestId = await recordRoadTest(tester, versionId)
  await tester.call('POST', `/api/vehicles/${car.id}/snags`, { kind: 'enhancement', title: 'Offer a second charging cable', detail: 'Type 2 to domestic plug' })
  const get = (who: { cookie: string }, path: string) => fetch(`${baseUrl}${path}`, { headers: { cookie: who.cookie } })

  it('409 before sign-off: the sheet follows sign-off', async () => {
    const res = await get(tuner, `/api/vehicles/${car.id}/handover.pdf`)
    expect(res.status).toBe(409)
  })

  it('is a real PDF with IBM Plex Sans embedded and the whole story in it', async () => {
    const signed = await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)
    expect(signed.status).toBe(200)
    const res = await get(tuner, `/api/vehicles/${car.id}/handover.pdf`)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toBe('application/pdf')
    expect(res.headers.get('content-disposition')).toContain(`handover-${car.stockRef}.pdf`)
    const pdf = Buffer.from(await res.arrayBuffer())
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-')
    expect(fonts(pdf)).toMatch(/IBMPlexSans/)
    const text = pdfText(pdf)
    expect(text).toContain('Handover sheet')
    expect(text).toContain('1967 Łowicz Coupé Särkkä') // latin-ext letters print from the latin-ext face
    expect(text).toContain(car.stockRef)
    expect(text).toContain('Ottoline Marsh')
    expect(text).toMatch(/Power cap\s+80 kW \(107 hp\)/) // 80 kW / 0.74569987 kW per hp = 107.3 hp (NIST SP 811)
    expect(text).toContain('Lift-off regen')
    expect(text).toContain('PASSED')
    expect(text).toMatch(/Hill start\s+Pass\s+Gradient 18 %, Roll-back 60 mm/)
    expect(text).toContain('Offer a second charging cable')
    expect(text).toMatch(/Proposed by\s+Dev Carrow/)
    expect(text).toMatch(/Approved by\s+Maud Ellery/)
    expect(text).toMatch(/signed off by\s+Sol Brannagh/)
    // The fingerprints are for auditors: after the owner's cautions, not among the people.
    const flat = text.replace(/\s+/g, '')
    expect(flat).toContain(signed.body.signed.contentHash)
    expect(flat.indexOf(signed.body.signed.contentHash)).toBeGreaterThan(flat.indexOf('Pleaseread'))
    expect(flat.indexOf('Foraudito')).toBeGreaterThan(flat.indexOf('Pleaseread'))
    expect(text).toContain('qualified engineer')
    expect(text).toContain('regulations')
    expect(text).toMatch(/page 1 of \d/)
  })

  it('the owner downloads their own; nobody else\'s; the JSON for the screen says the same', async () => {
    expect((await get(client, `/api/vehicles/${car.id}/handover.pdf`)).status).toBe(200)
    const someoneElses = await newCar(tuner)
    expect((await get(client, `/api/vehicles/${someoneElses.id}/handover.pdf`)).status).toBe(404)
    const sheet = await client.call('GET', `/api/vehicles/${car.id}/handover`)
    expect(sheet.body.car.title).toBe('1967 Łowicz Coupé Särkkä')
    expect(sheet.body.profiles[0].roadTest.verdict).toBe('pass')
    expect(sheet.body.enhancements.map((e: { title: string }) => e.title)).toEqual(['Offer a second charging cable'])
    expect(sheet.body.cautions.length).toBeGreaterThanOrEqual(3)
    expect(sheet.body.openWork).toEqual([])
    expect(sheet.body.openWorkAdvice).toMatch(/^None/)
  })

  it('tells the owner of faults and repairs still open, the most pressing first, and whether to drive', async () => {
    const raise = (title: string, kind: string, priority: string) => tester.call('POST', `/api/vehicles/${car.id}/snags`, { kind, title, priority })
    expect((await raise('Wiper slow on the second speed', 'remedial', 'normal')).status).toBe(201)
    let sheet = await client.call('GET', `/api/vehicles/${car.id}/handover`)
    expect(sheet.body.openWork.map((o: { title: string }) => o.title)).toEqual(['Wiper slow on the second speed'])
    expect(sheet.body.openWorkAdvice).not.toContain('do not drive')
    expect((await raise('Front caliper drags', 'conversion', 'urgent')).status).toBe(201)
    sheet = await client.call('GET', `/api/vehicles/${car.id}/handover`)
    expect(sheet.body.openWork).toEqual([
      { title: 'Front caliper drags', kind: 'Conversion fault', priority: 'Urgent' },
      { title: 'Wiper slow on the second speed', kind: 'Remedial work on the car', priority: 'Normal' }
    ])
    expect(sheet.body.openWorkAdvice).toContain('do not drive the car')
    const text = pdfText(Buffer.from(await (await get(client, `/api/vehicles/${car.id}/handover.pdf`)).arrayBuffer()))
    expect(text).toContain('Work still open on the car')
    expect(text).toMatch(/Conversion fault\s+Front caliper drags/)
    expect(text).toContain('do not drive the car')
    // The owner's own page says the same once the car is theirs; before that the workshop still has it.
    const view = async (status: string) => {
      await withDatabase(c => c.query('UPDATE vehicles SET status = $1 WHERE id = $2', [status, car.id]))
      return (await client.call('GET', `/api/vehicles/${car.id}/client-view`)).body
    }
    const atWorkshop = await view('snagging')
    expect(atWorkshop.openWork.map((o: { title: string, priority: string }) => `${o.title}: ${o.priority}`)).toEqual(['Front caliper drags: Urgent', 'Wiper slow on the second speed: Normal'])
    expect(atWorkshop.openWorkAdvice).toContain('before it hands the car over')
    expect((await view('handed-over')).openWorkAdvice).toContain('do not drive the car')
  })
})
