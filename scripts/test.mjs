// `npm test`: the whole suite from nothing, on its own ports and a throw-away data folder.
import { mkdtempSync, rmSync, chmodSync, mkdirSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { root, stackConfig, serverEnv } from './lib/config.mjs'
import { run, startChild, onShutdown, waitForHttp, shutdown } from './lib/processes.mjs'
import { startPostgres, stopServer } from './lib/postgres.mjs'
import { ensureDependencies, ensureBuild, sessionPassword, startMailSink, startObjectStore, runDbScript } from './lib/setup.mjs'
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
const step = (name, fn, part) => {
  if (part && !wanted(part)) return
  console.log(`\n[voltwright test] ${name}`)
  return fn()
}
// VOLTWRIGHT_API_FILES="route-guards bad-input" runs only those API test files (while working on them).
const apiFiles = (process.env.VOLTWRIGHT_API_FILES ?? '').split(/\s+/).filter(Boolean)
const bin = (name) => join(root, 'node_modules', '.bin', name)

try {
  mkdirSync(config.dataDir, { recursive: true })
  step('dependencies', ensureDependencies)
  step('lint', () => run(bin('eslint'), ['.'], { cwd: root }), 'lint')
  step('type-check', () => run(bin('nuxt'), ['typecheck'], { cwd: root }), 'types')
  step('unit tests', () => run(bin('vitest'), ['run', '--project', 'unit'], { cwd: root }), 'unit')
  const pgDir = join(config.dataDir, 'pg')
  step('database', () => { process.env.PG_FSYNC = 'off'; if (startPostgres(pgDir, config.pgPort)) onShutdown(() => stopServer(pgDir)) })
  const env = serverEnv(config, sessionPassword(config.dataDir))
  step('migrations and demo data', () => { runDbScript(config, env, 'migrate'); runDbScript(config, env, 'seed'); runDbScript(config, env, 'seed') })
  startMailSink(config)
  startObjectStore(config)
  step('build', ensureBuild)
  startChild('server', process.execPath, [join(root, '.output', 'server', 'index.mjs')], { env, cwd: root })
  await waitForHttp(`${config.baseUrl}/api/health`)
  const testEnv = {
    ...env,
    NODE_ENV: 'test',
    VOLTWRIGHT_BASE_URL: config.baseUrl,
    VOLTWRIGHT_ADMIN_DATABASE_URL: config.adminDatabaseUrl,
    VOLTWRIGHT_MAIL_API: `http://127.0.0.1:${config.mailWebPort}`,
    VOLTWRIGHT_PG_DIR: pgDir,
    VOLTWRIGHT_PG_PORT: String(config.pgPort)
  }
  step('API tests', () => { ensurePoppler(); return run(bin('vitest'), ['run', '--project', 'api', ...apiFiles], { cwd: root, env: testEnv }) }, 'api')
  step('browser tests', () => { testEnv.CHROMIUM_PATH = ensureChromium(); run(bin('vitest'), ['run', '--project', 'browser'], { cwd: root, env: testEnv }) }, 'browser')
  console.log('\n[voltwright test] all passed')
  await shutdown(0)
} catch (e) {
  console.error(`\n[voltwright test] FAILED: ${e.message}`)
  await shutdown(1)
}
