// A second server instance from the same build, on the same database, object store and SMTP server and with
// the same session password as the one npm test started (scripts/lib/stack.mjs), on its own port
// (VOLTWRIGHT_SECOND_PORT). Its pid is recorded in VOLTWRIGHT_RESTARTED_DIR, so scripts/test.mjs stops it
// even if the test run dies before stop() does.
import { spawn, type ChildProcess } from 'node:child_process'
import { rmSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'

const root = fileURLToPath(new URL('../..', import.meta.url))

// The first server's environment as the tests inherit it, without what marks this process as a test run.
function serverEnv(port: number): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = {}
  for (const [k, v] of Object.entries(process.env)) {
    if (!k.startsWith('VITEST') && k !== 'TEST') env[k] = v
  }
  return { ...env, NODE_ENV: 'production', PORT: String(port), HOST: '127.0.0.1' }
}

async function answersHealth(base: string) {
  try {
    return (await fetch(`${base}/api/health`, { signal: AbortSignal.timeout(2000) })).status === 200
  } catch {
    return false
  }
}

export interface SecondInstance { base: string, stop: () => Promise<void> }

export async function startSecondInstance(): Promise<SecondInstance> {
  const port = Number(process.env.VOLTWRIGHT_SECOND_PORT)
  if (!port || !process.env.NUXT_SESSION_PASSWORD) throw new Error('VOLTWRIGHT_SECOND_PORT is not set: run the API tests through npm test')
  const base = `http://127.0.0.1:${port}`
  if (await answersHealth(base)) throw new Error(`something already answers on port ${port}`)
  let output = ''
  const child: ChildProcess = spawn(process.execPath, [join(root, '.output', 'server', 'index.mjs')], { cwd: root, env: serverEnv(port), stdio: ['ignore', 'pipe', 'pipe'] })
  child.stdout!.on('data', (d: Buffer) => { output += d })
  child.stderr!.on('data', (d: Buffer) => { output += d })
  const pidFile = join(process.env.VOLTWRIGHT_RESTARTED_DIR ?? root, `second-server-${child.pid}.pid`)
  if (process.env.VOLTWRIGHT_RESTARTED_DIR) writeFileSync(pidFile, String(child.pid))
  const exited = new Promise<void>(resolve => child.once('exit', () => resolve()))

  async function stop() {
    if (child.exitCode === null && child.signalCode === null) {
      child.kill('SIGTERM')
      const killed = setTimeout(() => child.kill('SIGKILL'), 10_000)
      await exited
      clearTimeout(killed)
    }
    rmSync(pidFile, { force: true })
  }

  const until = Date.now() + 60_000
  while (!(await answersHealth(base))) {
    if (child.exitCode !== null || Date.now() > until) {
      await stop()
      throw new Error(`the second instance did not start on port ${port}:\n${output.slice(-2000)}`)
    }
    await new Promise(r => setTimeout(r, 250))
  }
  return { base, stop }
}
