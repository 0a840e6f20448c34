// A small layout layer over pdfkit for Voltwright's printed sheets: IBM Plex Sans with a latin-ext
// fallback per character, the house colours, section headings, label/value rows and safety symbols.
import PDFDocument from 'pdfkit'

export const ink = { graphite: '#2a2926', soft: '#4a4843', mute: '#6b675f', copper: '#a4551f', edge: '#d9cfbd', paper: '#f6f2ea', danger: '#b3261e', caution: '#f2c230', pass: '#2e7d32' }
export type Weight = 'regular' | 'semibold'
export type Symbol = 'danger' | 'caution' | 'info' | 'pass' | 'fail'

interface Glyphs { hasGlyphForCodePoint: (cp: number) => boolean }
const FONT_FILES = { 'regular': '400', 'semibold': '600' } as const

async function fontFile(subset: 'latin' | 'latin-ext', weight: Weight): Promise<Buffer> {
  const raw = await useStorage('assets:fonts').getItemRaw(`ibm-plex-sans-${subset}-${FONT_FILES[weight]}-normal.woff`)
  if (!raw) throw new Error(`IBM Plex Sans ${subset} ${weight} is missing from the server's assets`)
  return Buffer.from(raw as Uint8Array)
}

export class SheetWriter {
  readonly doc: PDFKit.PDFDocument
  private glyphs = new Map<string, Glyphs>()
  readonly left = 50
  readonly width: number

  private constructor(doc: PDFKit.PDFDocument) {
    this.doc = doc
    this.width = doc.page.width - 100
  }

  static async create(info: PDFKit.DocumentInfo): Promise<SheetWriter> {
    const doc = new PDFDocument({ size: 'A4', margins: { top: 56, bottom: 64, left: 50, right: 50 }, bufferPages: true, info, pdfVersion: '1.7', lang: 'en-GB' } as PDFKit.PDFDocumentOptions)
    const w = new SheetWriter(doc)
    for (const weight of ['regular', 'semibold'] as const) {
      for (const subset of ['latin', 'latin-ext'] as const) {
        const name = `${subset}-${weight}`
        doc.registerFont(name, await fontFile(subset, weight))
        doc.font(name)
        w.glyphs.set(name, (doc as unknown as { _font: { font: Glyphs } })._font.font)
      }
    }
    doc.font('latin-regular')
    return w
  }

  // Splits text into runs by which subset has the glyph, so "Łódź Coupé" prints whole.
  private runs(text: string, weight: Weight): { font: string, text: string }[] {
    const main = `latin-${weight}`
    const ext = `latin-ext-${weight}`
    const out: { font: string, text: string }[] = []
    for (const ch of text) {
      const cp = ch.codePointAt(0)!
      const font = this.glyphs.get(main)!.hasGlyphForCodePoint(cp) || cp < 0x20 ? main : this.glyphs.get(ext)!.hasGlyphForCodePoint(cp) ? ext : main
      const last = out[out.length - 1]
      if (last && last.font === font) last.text += ch
      else out.push({ font, text: ch })
    }
    return out
  }

  text(text: string, o: { x?: number, y?: number, width?: number, size?: number, weight?: Weight, color?: string, align?: 'left' | 'right' | 'center', lineGap?: number } = {}) {
    const { doc } = this
    doc.fontSize(o.size ?? 10).fillColor(o.color ?? ink.graphite)
    const runs = this.runs(text || ' ', o.weight ?? 'regular')
    const x = o.x ?? this.left
    if (o.y !== undefined) doc.y = o.y
    runs.forEach((r, i) => {
      doc.font(r.font)
      const opts = { width: o.width ?? this.width - (x - this.left), align: o.align ?? 'left', lineGap: o.lineGap ?? 1.5, continued: i < runs.length - 1 }
      if (i === 0) doc.text(r.text, x, doc.y, opts)
      else doc.text(r.text, opts)
    })
    return this
  }

  height(text: string, width: number, size = 10, weight: Weight = 'regular') {
    this.doc.font(`latin-${weight}`).fontSize(size)
    return this.doc.heightOfString(text || ' ', { width, lineGap: 1.5 })
  }

  get bottom() {
    return this.doc.page.height - this.doc.page.margins.bottom
  }

  // Starts a new page unless `needed` points still fit.
  ensure(needed: number) {
    if (this.doc.y + needed > this.bottom) this.doc.addPage()
  }

  section(title: string) {
    this.ensure(60)
    const { doc } = this
    doc.y += 10
    this.text(title, { size: 12.5, weight: 'semibold', color: ink.copper })
    doc.moveTo(this.left, doc.y + 2).lineTo(this.left + this.width, doc.y + 2).lineWidth(0.6).strokeColor(ink.edge).stroke()
    doc.y += 8
  }

  // A label beside its value, with an optional plain-words note under the value.
  row(label: string, value: string, note?: string, labelWidth = 170) {
    const valueWidth = this.width - labelWidth - 10
    const h = Math.max(this.height(label, labelWidth, 9.5), this.height(value, valueWidth, 10, 'semibold') + (note ? this.height(note, valueWidth, 8.5) + 1 : 0))
    this.ensure(h + 6)
    const y = this.doc.y
    this.text(label, { x: this.left, y, width: labelWidth, size: 9.5, color: ink.soft })
    this.text(value, { x: this.left + labelWidth + 10, y, width: valueWidth, size: 10, weight: 'semibold' })
    if (note) this.text(note, { x: this.left + labelWidth + 10, width: valueWidth, size: 8.5, color: ink.mute })
    this.doc.y = Math.max(this.doc.y, y + h) + 4
  }

  // ISO 3864 shapes: a yellow triangle for caution, red for danger, a green square for pass; always with a word.
  symbol(kind: Symbol, x: number, y: number, s = 11) {
    const { doc } = this
    doc.save()
    if (kind === 'caution' || kind === 'danger') {
      doc.moveTo(x + s / 2, y).lineTo(x + s, y + s).lineTo(x, y + s).closePath().lineWidth(0.8)
        .fillAndStroke(kind === 'caution' ? ink.caution : ink.danger, ink.graphite)
      doc.rect(x + s / 2 - 0.6, y + s * 0.35, 1.2, s * 0.35).fill(kind === 'caution' ? ink.graphite : '#ffffff')
      doc.circle(x + s / 2, y + s * 0.84, 0.75).fill(kind === 'caution' ? ink.graphite : '#ffffff')
    } else if (kind === 'pass') {
      doc.rect(x, y, s, s).fill(ink.pass)
      doc.moveTo(x + s * 0.22, y + s * 0.52).lineTo(x + s * 0.42, y + s * 0.74).lineTo(x + s * 0.8, y + s * 0.28).lineWidth(1.4).strokeColor('#ffffff').stroke()
    } else if (kind === 'fail') {
      doc.circle(x + s / 2, y + s / 2, s / 2).fill(ink.danger)
      doc.moveTo(x + s * 0.3, y + s * 0.3).lineTo(x + s * 0.7, y + s * 0.7).moveTo(x + s * 0.7, y + s * 0.3).lineTo(x + s * 0.3, y + s * 0.7).lineWidth(1.4).strokeColor('#ffffff').stroke()
    } else {
      doc.circle(x + s / 2, y + s / 2, s / 2).lineWidth(0.8).stroke(ink.graphite)
      doc.rect(x + s / 2 - 0.6, y + s * 0.42, 1.2, s * 0.34).fill(ink.graphite)
      doc.circle(x + s / 2, y + s * 0.26, 0.75).fill(ink.graphite)
    }
    doc.restore()
  }

  // Page numbers and the sheet's name in the bottom margin of every page.
  footer(text: (page: number, pages: number) => string) {
    const { doc } = this
    const range = doc.bufferedPageRange()
    for (let i = range.start; i < range.start + range.count; i++) {
      doc.switchToPage(i)
      const bottom = doc.page.margins.bottom
      doc.page.margins.bottom = 0
      doc.moveTo(this.left, doc.page.height - 48).lineTo(this.left + this.width, doc.page.height - 48).lineWidth(0.5).strokeColor(ink.edge).stroke()
      this.text(text(i + 1, range.count), { x: this.left, y: doc.page.height - 42, size: 8, color: ink.mute })
      doc.page.margins.bottom = bottom
    }
  }

  finish(): Promise<Buffer> {
    return new Promise((resolve, reject) => {
      const parts: Buffer[] = []
      this.doc.on('data', (b: Buffer) => parts.push(b))
      this.doc.on('end', () => resolve(Buffer.concat(parts)))
      this.doc.on('error', reject)
      this.doc.end()
    })
  }
}
