import { execFileSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'

// poppler's pdftotext (Debian poppler-utils, installed by the test command) reads the text back.
export function pdfText(pdf: Buffer): string {
  const dir = mkdtempSync(join(tmpdir(), 'voltwright-pdf-'))
  writeFileSync(join(dir, 'sheet.pdf'), pdf)
  return execFileSync('pdftotext', ['-layout', join(dir, 'sheet.pdf'), '-'], { encoding: 'utf8' })
}
