// `npm test`: the whole suite from nothing, on its own ports and a throw-away data folder.
import { mkdtempSync, rmSync, chmodSync, mkdirSync, readdirSync, readFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { root, stackConfig } from './lib/config.mjs'
import { runAsync, onShutdown, shutdown } from './lib/processes.mjs'
import { ensureDependencies } from './lib/setup.mjs'
import { bringUp } from './lib/stack.mjs'
import { ensureChromium } from './lib/chromium.mjs'
import { ensurePoppler } from './lib/poppler.mjs'

// A folder under the system temp dir, so the `postgres` user can reach it wherever the clone lives.
const scratch = process.env.DATA_DIR ? null : mkdtempSync(join(tmpdir(), 'voltwright-test-'))
if (scratch) chmodSync(scratch, 0o755)
const config = stackConfig({ PORT: 3100, DATA_DIR: scratch, PG_PORT: 54339, S3_PORT: 4579, SMTP_PORT: 1035, MAIL_WEB_PORT: 1090 })
if (scratch) onShutdown(() => rmSync(scratch, { recursive: true, force: true }))

// `npm test -- api browser` runs only those parts (lint, types, unit, api, browser); no argument runs all.
const only = new Set(process.argv.slice(2))
const wanted = (part) => only.size === 0 || only.has(part)
const step = async (name, fn, part) => {
  if (part && !wanted(part)) return
  console.log(`\n[voltwright test] ${name}`)
  await fn()
}
// VOLTWRIGHT_API_FILES="route-guards bad-input" runs only those API test files (while working on them);
// VOLTWRIGHT_BROWSER_FILES does the same for the browser tests.
const filesFrom = (name) => (process.env[name] ?? '').split(/\s+/).filter(Boolean)
const apiFiles = filesFrom('VOLTWRIGHT_API_FILES')
const browserFiles = filesFrom('VOLTWRIGHT_BROWSER_FILES')
const bin = (name) => join(root, 'node_modules', '.bin', name)

function stopRestarted(dir) {
  for (const file of readdirSync(dir)) {
    try { process.kill(Number(readFileSync(join(dir, file), 'utf8')), 'SIGTERM') } catch { /* already gone */ }
  }
}

try {
  mkdirSync(config.dataDir, { recursive: true })
  await step('dependencies', ensureDependencies)
  await step('lint', () => runAsync(bin('eslint'), ['.'], { cwd: root }), 'lint')
  await step('type-check', () => runAsync(bin('nuxt'), ['typecheck'], { cwd: root }), 'types')
  await step('unit tests', () => runAsync(bin('vitest'), ['run', '--project', 'unit'], { cwd: root }), 'unit')
  const restartedDir = join(config.dataDir, 'restarted-services')
  mkdirSync(restartedDir, { recursive: true })
  onShutdown(() => stopRestarted(restartedDir))
  // The fault tests stop the mail and object-store stand-ins and start them again (tests/api/services.ts):
  // not fatal here, and what they start is recorded in the data folder and stopped with the rest.
  // The tests speak as the reverse proxy on this machine, so that X-Forwarded-For can name other clients (tests/api/trust-sign-in.test.ts).
  process.env.NUXT_TRUSTED_PROXIES ??= '127.0.0.1,::1'
  const { env, pgDir, mailSink, objectStore } = await bringUp(config, { step, fsync: 'off', seedTwice: true, servicesCritical: false })
  const testEnv = {
    ...env,
    NODE_ENV: 'test',
    VOLTWRIGHT_BASE_URL: config.baseUrl,
    VOLTWRIGHT_ADMIN_DATABASE_URL: config.adminDatabaseUrl,
    VOLTWRIGHT_MAIL_API: `http://127.0.0.1:${config.mailWebPort}`,
    VOLTWRIGHT_PG_DIR: pgDir,
    VOLTWRIGHT_PG_PORT: String(config.pgPort),
    VOLTWRIGHT_MAIL_SINK: JSON.stringify({ pid: mailSink.pid, command: mailSink.spawnargs }),
    VOLTWRIGHT_OBJECT_STORE: JSON.stringify({ pid: objectStore.pid, command: objectStore.spawnargs }),
    VOLTWRIGHT_RESTARTED_DIR: restartedDir,
    // tests/api/instances.test.ts starts a second server instance from the same build on this port.
    VOLTWRIGHT_SECOND_PORT: process.env.SECOND_PORT || String(config.port + 1)
  }
  await step('API tests', () => { ensurePoppler(); return runAsync(bin('vitest'), ['run', '--project', 'api', ...apiFiles], { cwd: root, env: testEnv }) }, 'api')
  await step('browser tests', () => { testEnv.CHROMIUM_PATH = ensureChromium(); ensurePoppler(); return runAsync(bin('vitest'), ['run', '--project', 'browser', ...browserFiles], { cwd: root, env: testEnv }) }, 'browser')
  console.log('\n[voltwright test] all passed')
  await shutdown(0)
} catch (e) {
  console.error(`\n[voltwright test] FAILED: ${e.message}`)
  await shutdown(1)
}
