// `npm start`: sets up what is missing, then runs Voltwright with demo data on http://localhost:3000.
import { stackConfig } from './lib/config.mjs'
import { shutdown } from './lib/processes.mjs'
import { bringUp } from './lib/stack.mjs'

const config = stackConfig({ PORT: 3000, DATA_DIR: '.data', PG_PORT: 54329, S3_PORT: 4569, SMTP_PORT: 1025, MAIL_WEB_PORT: 1080 })

try {
  await bringUp(config)
  console.log(`
Voltwright is running on ${config.baseUrl}
  sign in as tuner@voltwright.test (or admin, engineer, tester, auditor, client) with the demo password voltwright-demo
  mail sent by the product: http://localhost:${config.mailWebPort}
Press Ctrl-C to stop.`)
} catch (e) {
  console.error(`[voltwright] ${e.message}`)
  await shutdown(1)
}
