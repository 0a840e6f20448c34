// Starts child processes and stops exactly those on Ctrl-C, SIGTERM or exit.
import { spawn, spawnSync } from 'node:child_process'

const children = []
const stoppers = []

export function run(cmd, args, options = {}) {
  const r = spawnSync(cmd, args, { stdio: options.quiet ? 'pipe' : 'inherit', encoding: 'utf8', ...options })
  if (r.status !== 0 && !options.allowFailure) {
    const detail = options.quiet ? `\n${r.stdout ?? ''}${r.stderr ?? ''}` : ''
    throw new Error(`${cmd} ${args.join(' ')} failed (exit ${r.status})${detail}`)
  }
  return r
}

// The same, without blocking: a signal arriving meanwhile stops the command too (a build, npm ci, a test run).
export function runAsync(cmd, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { stdio: 'inherit', ...options })
    const entry = { name: cmd, child }
    children.push(entry)
    child.on('error', reject)
    child.on('exit', (code, signal) => {
      children.splice(children.indexOf(entry), 1)
      if (code === 0) resolve()
      else reject(new Error(`${cmd} ${args.join(' ')} failed (${signal ?? `exit ${code}`})`))
    })
  })
}

export function startChild(name, cmd, args, options = {}) {
  const child = spawn(cmd, args, { stdio: ['ignore', 'inherit', 'inherit'], ...options })
  child.on('exit', (code, signal) => {
    if (!stopping && options.critical !== false) {
      console.error(`[voltwright] ${name} stopped (${signal ?? code}); shutting down`)
      shutdown(1)
    }
  })
  children.push({ name, child })
  return child
}

export function onShutdown(fn) { stoppers.push(fn) }

let stopping = false
export async function shutdown(code = 0) {
  if (stopping) return
  stopping = true
  const gone = (child) => child.exitCode !== null || child.signalCode !== null
  for (const { child } of children.reverse()) {
    if (!gone(child)) child.kill('SIGTERM')
  }
  await Promise.all(children.map(({ child }) => gone(child) ? null : new Promise(r => { child.once('exit', r); setTimeout(r, 5000) })))
  for (const fn of stoppers.reverse()) {
    try { await fn() } catch (e) { console.error(e.message) }
  }
  process.exit(code)
}

for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => shutdown(0))

export async function waitForHttp(url, timeoutMs = 60000) {
  const until = Date.now() + timeoutMs
  while (Date.now() < until) {
    try {
      const r = await fetch(url)
      if (r.status < 500) return
    } catch { /* not up yet */ }
    await new Promise(r => setTimeout(r, 250))
  }
  throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`)
}
