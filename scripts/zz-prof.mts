import { createReadStream } from 'node:fs'
import { digestTelemetry } from '../server/utils/telemetry-csv'
const file = process.argv[2]!
for (let i = 0; i < 3; i++) {
  const c = process.cpuUsage(); const t = performance.now()
  await digestTelemetry(createReadStream(file, { highWaterMark: 65536 }))
  const u = process.cpuUsage(c)
  console.log(`wall ${(performance.now() - t).toFixed(0)} cpu ${((u.user + u.system) / 1000).toFixed(0)}`)
}
