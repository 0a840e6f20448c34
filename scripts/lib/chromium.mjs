// Debian's chromium for the browser tests, installed when missing (playwright cannot download its own here).
import { existsSync } from 'node:fs'
import { run } from './processes.mjs'

export function ensureChromium() {
  const path = process.env.CHROMIUM_PATH || '/usr/bin/chromium'
  if (existsSync(path)) return path
  if (process.getuid?.() !== 0) throw new Error('Chromium is missing: install Debian\'s `chromium` package as root.')
  console.log('[voltwright test] installing Debian\'s chromium package')
  run('apt-get', ['update', '-qq'])
  run('apt-get', ['install', '-y', '-qq', 'chromium'], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } })
  return path
}
