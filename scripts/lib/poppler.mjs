// Debian's poppler-utils (pdftotext, pdffonts) for the handover PDF's tests, installed when missing.
import { spawnSync } from 'node:child_process'
import { run } from './processes.mjs'

export function ensurePoppler() {
  if (spawnSync('pdftotext', ['-v'], { stdio: 'ignore' }).status === 0) return
  if (process.getuid?.() !== 0) throw new Error('pdftotext is missing: install Debian\'s `poppler-utils` package as root.')
  console.log('[voltwright test] installing Debian\'s poppler-utils package')
  run('apt-get', ['update', '-qq'])
  run('apt-get', ['install', '-y', '-qq', 'poppler-utils'], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } })
}
