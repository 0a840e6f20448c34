// Stops one of the stack's hosted-service stand-ins (maildev, s3rver) and starts it again on the same ports
// with the same command line. What it starts is recorded in VOLTWRIGHT_RESTARTED_DIR; scripts/test.mjs stops it.
import { spawn } from 'node:child_process'
import { writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { expect } from 'vitest'

interface Running { pid: number, command: string[] }

async function answers(url: string) {
  try {
    await fetch(url, { signal: AbortSignal.timeout(2000) })
    return true
  } catch {
    return false
  }
}

export function service(name: 'mail-sink' | 'object-store', env: string, probeUrl: string) {
  const running = JSON.parse(process.env[env] ?? 'null') as Running | null
  if (!running) throw new Error(`${env} is not set: run the API tests through npm test`)
  let pid = running.pid
  return {
    async stop() {
      process.kill(pid, 'SIGTERM')
      await expect.poll(() => answers(probeUrl), { timeout: 10000, interval: 100 }).toBe(false)
    },
    async start() {
      const [cmd, ...args] = running.command
      const child = spawn(cmd!, args, { detached: true, stdio: 'ignore' })
      child.unref()
      pid = child.pid!
      writeFileSync(join(process.env.VOLTWRIGHT_RESTARTED_DIR!, `${name}-${pid}.pid`), String(pid))
      await expect.poll(() => answers(probeUrl), { timeout: 20000, interval: 200 }).toBe(true)
    }
  }
}
