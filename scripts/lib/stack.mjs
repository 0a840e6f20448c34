// The stack `npm start`, `npm test` and `npm run bench` all run: PostgreSQL, migrations and demo data,
// the mail and object-store stand-ins, the build and the built server, stopped together on shutdown.
import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import { root, serverEnv } from './config.mjs'
import { startChild, onShutdown, waitForHttp } from './processes.mjs'
import { startPostgres, stopServer } from './postgres.mjs'
import { ensureDependencies, ensureBuild, sessionPassword, startMailSink, startObjectStore, runDbScript } from './setup.mjs'

// options.step(name, fn) announces each stage (npm test prints them); options.fsync 'off' for throw-away data;
// options.seedTwice proves the seeders idempotent; options.afterSeed(env) adds data before the server starts;
// options.servicesCritical false lets a test stop the stand-ins without the whole stack shutting down.
export async function bringUp(config, options = {}) {
  const step = options.step ?? ((_name, fn) => fn())
  mkdirSync(config.dataDir, { recursive: true, mode: 0o755 })
  await ensureDependencies()
  const pgDir = join(config.dataDir, 'pg')
  await step('database', () => {
    if (options.fsync) process.env.PG_FSYNC = options.fsync
    if (startPostgres(pgDir, config.pgPort)) onShutdown(() => stopServer(pgDir))
  })
  const env = serverEnv(config, sessionPassword(config.dataDir))
  await step('migrations and demo data', async () => {
    await runDbScript(config, env, 'migrate')
    await runDbScript(config, env, 'seed')
    if (options.seedTwice) await runDbScript(config, env, 'seed') // a second run must change nothing
    if (options.afterSeed) await options.afterSeed(env)
  })
  const critical = options.servicesCritical ?? true
  const mailSink = startMailSink(config, { critical })
  const objectStore = startObjectStore(config, { critical })
  await step('build', ensureBuild)
  // SERVER_NODE_ARGS adds Node options to the server alone, e.g. `--cpu-prof --cpu-prof-dir=/tmp/prof` for a profile.
  const nodeArgs = (process.env.SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean)
  const server = startChild('server', process.execPath, [...nodeArgs, join(root, '.output', 'server', 'index.mjs')], { env, cwd: root })
  await waitForHttp(`${config.baseUrl}/api/health`)
  return { env, pgDir, mailSink, objectStore, server }
}
