// `npm start`: sets up what is missing, then runs Voltwright with demo data on http://localhost:3000.
import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import { root, stackConfig, serverEnv } from './lib/config.mjs'
import { startChild, onShutdown, waitForHttp, shutdown } from './lib/processes.mjs'
import { startPostgres, stopServer } from './lib/postgres.mjs'
import { ensureDependencies, ensureBuild, sessionPassword, startMailSink, startObjectStore, runDbScript } from './lib/setup.mjs'

const config = stackConfig({ PORT: 3000, DATA_DIR: '.data', PG_PORT: 54329, S3_PORT: 4569, SMTP_PORT: 1025, MAIL_WEB_PORT: 1080 })

try {
  mkdirSync(config.dataDir, { recursive: true, mode: 0o755 })
  await ensureDependencies()
  const pgDir = join(config.dataDir, 'pg')
  if (startPostgres(pgDir, config.pgPort)) onShutdown(() => stopServer(pgDir))
  const env = serverEnv(config, sessionPassword(config.dataDir))
  await runDbScript(config, env, 'migrate')
  await runDbScript(config, env, 'seed')
  startMailSink(config)
  startObjectStore(config)
  await ensureBuild()
  startChild('server', process.execPath, [join(root, '.output', 'server', 'index.mjs')], { env, cwd: root })
  await waitForHttp(`${config.baseUrl}/api/health`)
  console.log(`
Voltwright is running on ${config.baseUrl}
  sign in as tuner@voltwright.test (or admin, engineer, tester, auditor, client) with the demo password voltwright-demo
  mail sent by the product: http://localhost:${config.mailWebPort}
Press Ctrl-C to stop.`)
} catch (e) {
  console.error(`[voltwright] ${e.message}`)
  await shutdown(1)
}
