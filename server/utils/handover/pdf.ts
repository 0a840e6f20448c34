// The handover sheet as a PDF the owner keeps: set like a workshop manual page, IBM Plex Sans embedded.
import { formatDateTime } from '../../../shared/utils/dates'
import type { HandoverProfile, HandoverSheet } from '../../../shared/schemas/handover'
import { ink, SheetWriter, type Symbol } from './pdf-writer'

const severityWords: Record<string, string> = { danger: 'DANGER', caution: 'CAUTION', info: 'NOTE' }
const day = (iso: string | null) => iso ? `${formatDateTime(iso, { timeZone: 'UTC' })} UTC` : '—'

function header(w: SheetWriter, s: HandoverSheet) {
  const { doc } = w
  doc.rect(0, 0, doc.page.width, 8).fill(ink.copper)
  w.text(`VOLTWRIGHT  ·  ${s.workshop.toUpperCase()}`, { y: 30, size: 8, weight: 'semibold', color: ink.mute })
  w.text('Handover sheet', { y: 44, size: 24, weight: 'semibold' })
  w.text(s.car.title, { size: 15, color: ink.soft })
  doc.y += 4
  const meta = [`Stock ref ${s.car.stockRef}`, s.car.registration ? `Registration ${s.car.registration}` : null, s.car.chassisNumber ? `Chassis ${s.car.chassisNumber}` : null, s.car.owner ? `Owner ${s.car.owner}` : null].filter(Boolean).join('   ·   ')
  w.text(meta, { size: 9, color: ink.mute })
  w.text(`Prepared ${day(s.generatedAt)}`, { size: 9, color: ink.mute })
  doc.y += 6
}

function warnings(w: SheetWriter, p: HandoverProfile) {
  w.section('What the checks flagged, and why it was accepted')
  if (!p.warnings.length) {
    w.symbol('pass', w.left, w.doc.y + 1)
    w.text('PASS  No safety check raised a warning for these settings on this car.', { x: w.left + 18, size: 10 })
    return
  }
  for (const warn of p.warnings) {
    const body = warn.message
    const why = warn.justification ? `Accepted because: ${warn.justification}` : 'Noted by the reviewing engineer.'
    const h = w.height(body, w.width - 90, 9.5) + w.height(why, w.width - 90, 9) + 10
    w.ensure(h)
    const y = w.doc.y
    w.symbol(warn.severity as Symbol, w.left, y + 1)
    w.text(severityWords[warn.severity] ?? warn.severity, { x: w.left + 16, y, width: 60, size: 8.5, weight: 'semibold', color: warn.severity === 'danger' ? ink.danger : ink.graphite })
    w.text(body, { x: w.left + 80, y, width: w.width - 80, size: 9.5 })
    w.text(why, { x: w.left + 80, width: w.width - 80, size: 9, color: ink.mute })
    w.doc.y += 6
  }
}

function roadTest(w: SheetWriter, p: HandoverProfile) {
  w.section('The road test')
  const rt = p.roadTest
  if (!rt) return w.text('No signed road test is recorded for this version.', { size: 10 })
  const y0 = w.doc.y
  w.symbol(rt.verdict === 'pass' ? 'pass' : 'fail', w.left, y0 + 1, 13)
  w.text(`${rt.verdict === 'pass' ? 'PASSED' : 'FAILED'}  on ${day(rt.testedAt)}, driven by ${rt.tester}`, { x: w.left + 20, y: y0, size: 11, weight: 'semibold' })
  w.text(`Conditions: ${rt.conditions}`, { x: w.left + 20, size: 9.5, color: ink.soft })
  w.doc.y += 6
  const cols = [w.left, w.left + 110, w.left + 190, w.left + 350]
  const widths = [105, 75, 155, w.width - 300]
  const heads = ['Check', 'Verdict', 'Measured', 'Note']
  const headY = w.doc.y
  heads.forEach((h, i) => w.text(h, { x: cols[i], y: headY, width: widths[i], size: 8.5, weight: 'semibold', color: ink.mute }))
  w.doc.y = headY + 14
  for (const c of rt.checks) {
    const h = Math.max(w.height(c.measured, widths[2]!, 9), w.height(c.note || '—', widths[3]!, 8.5), 12) + 6
    w.ensure(h)
    const y = w.doc.y
    w.doc.moveTo(w.left, y - 2).lineTo(w.left + w.width, y - 2).lineWidth(0.4).strokeColor(ink.edge).stroke()
    w.text(c.label, { x: cols[0], y, width: widths[0], size: 9.5, weight: 'semibold' })
    const kind = c.verdict === 'Pass' ? 'pass' : c.verdict === 'Fail' ? 'fail' : 'info'
    w.symbol(kind, cols[1]!, y + 1, 9)
    w.text(c.verdict, { x: cols[1]! + 13, y, width: widths[1]! - 13, size: 9.5 })
    w.text(c.measured, { x: cols[2], y, width: widths[2], size: 9 })
    w.text(c.note || '—', { x: cols[3], y, width: widths[3], size: 8.5, color: ink.mute })
    w.doc.y = y + h
  }
  if (rt.log.length) {
    w.doc.y += 6
    w.text('From the controller\'s log', { size: 10, weight: 'semibold' })
    w.doc.y += 2
    for (const l of rt.log) w.row(l.label, l.value)
  }
}

function people(w: SheetWriter, p: HandoverProfile) {
  w.section('Who proposed, approved and tested it')
  for (const person of p.people) {
    w.ensure(40)
    w.row(person.role, `${person.name}, ${day(person.at)}`, undefined, 150)
  }
}

// The records' fingerprints, once each, at the end of the sheet where the owner's reading is done.
function fingerprints(w: SheetWriter, s: HandoverSheet) {
  w.section('For auditors: the records\' fingerprints')
  w.text('Each hash is a SHA-256 fingerprint of the record as it was approved or signed. The workshop\'s register can show that the record has not changed since.', { size: 8, color: ink.mute })
  w.doc.y += 4
  for (const p of s.profiles) {
    const seen = new Set<string>()
    for (const person of p.people) {
      if (!person.hash || seen.has(person.hash)) continue
      seen.add(person.hash)
      w.ensure(28)
      w.text(`“${p.profileName}”, version ${p.versionNo}: ${person.hashLabel}`, { size: 8.5, color: ink.soft })
      w.text(person.hash, { size: 8.5 })
      w.doc.y += 3
    }
  }
}

function notice(w: SheetWriter, s: HandoverSheet) {
  if (!s.notice) return
  const h = w.height(s.notice, w.width - 54, 10.5) + 20
  const y = w.doc.y
  w.doc.rect(w.left, y, w.width, h).fill(ink.paper)
  w.doc.rect(w.left, y, 3, h).fill(ink.danger)
  w.symbol('danger', w.left + 14, y + 10, 14)
  w.text(s.notice, { x: w.left + 40, y: y + 10, width: w.width - 54, size: 10.5, weight: 'semibold' })
  w.doc.y = y + h + 6
}

function profile(w: SheetWriter, p: HandoverProfile) {
  w.section(`Controller settings on the car: “${p.profileName}”, version ${p.versionNo}`)
  w.text(`Signed off ${day(p.signedOffAt)}. These are the settings in the motor controller at handover.`, { size: 9.5, color: ink.soft })
  w.doc.y += 4
  for (const s of p.settings) w.row(s.label, s.value, s.note)
  w.section('What that means on the road')
  for (const f of p.figures) w.row(f.label, f.value, f.note)
  w.text('Figures are calculated for the car with driver and passenger on a level, dry road; they are a guide, not a guarantee.', { size: 8, color: ink.mute })
  warnings(w, p)
  roadTest(w, p)
  people(w, p)
}

function cautions(w: SheetWriter, s: HandoverSheet) {
  const text = s.cautions.map(c => `•  ${c}`).join('\n')
  const h = w.height(text, w.width - 40, 9.5) + s.cautions.length * 4 + 24
  w.ensure(h + 60) // the heading stays with its box
  w.section('Please read')
  const y = w.doc.y
  w.doc.rect(w.left, y, w.width, h).fill(ink.paper)
  w.doc.rect(w.left, y, 3, h).fill(ink.copper)
  w.symbol('caution', w.left + 14, y + 12, 14)
  w.doc.y = y + 10
  for (const c of s.cautions) {
    w.text(c, { x: w.left + 40, width: w.width - 54, size: 9.5 })
    w.doc.y += 4
  }
  w.doc.y = y + h + 4
}

export async function renderHandoverPdf(s: HandoverSheet): Promise<Buffer> {
  const w = await SheetWriter.create({ Title: `Handover sheet: ${s.car.title} (${s.car.stockRef})`, Author: s.workshop, Subject: 'Motor-controller settings at handover', Creator: 'Voltwright' })
  header(w, s)
  notice(w, s)
  w.section('The car')
  for (const f of s.carFacts) w.row(f.label, f.value, f.note)
  for (const p of s.profiles) profile(w, p)
  w.section('Work still open on the car')
  for (const o of s.openWork) w.row(o.kind, o.title, `Priority: ${o.priority}`)
  w.text(s.openWorkAdvice, { size: 10, weight: s.openWork.length ? 'semibold' : 'regular' })
  w.section('Enhancements we can offer')
  if (!s.enhancements.length) w.text('None outstanding.', { size: 10 })
  for (const e of s.enhancements) w.row(e.title, e.detail || '—', `Priority: ${e.priority}`)
  cautions(w, s)
  fingerprints(w, s)
  w.footer((page, pages) => `${s.car.stockRef}  ·  ${s.car.title}  ·  Handover sheet  ·  page ${page} of ${pages}`)
  return w.finish()
}
