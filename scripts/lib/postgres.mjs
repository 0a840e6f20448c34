// Debian's PostgreSQL server in a data folder of the project's own, listening on 127.0.0.1 only.
import { existsSync, mkdirSync, chownSync, readdirSync } from 'node:fs'
import { join } from 'node:path'
import { execFile, execFileSync } from 'node:child_process'
import { run } from './processes.mjs'

const isRoot = process.getuid?.() === 0

function pgBinDir() {
  const base = '/usr/lib/postgresql'
  if (!existsSync(base)) return null
  const versions = readdirSync(base).filter(v => existsSync(join(base, v, 'bin', 'pg_ctl'))).sort((a, b) => Number(b) - Number(a))
  return versions.length ? join(base, versions[0], 'bin') : null
}

export function ensurePostgresInstalled() {
  if (pgBinDir()) return
  if (!isRoot) throw new Error('PostgreSQL is not installed: run `apt-get install postgresql` as root, then try again.')
  console.log('[voltwright] installing Debian\'s postgresql package')
  run('apt-get', ['update', '-qq'])
  run('apt-get', ['install', '-y', '-qq', 'postgresql'], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } })
}

// As root the server must run as the `postgres` user; otherwise as whoever we are.
function asPostgres(cmd, args, options = {}) {
  const bin = join(pgBinDir(), cmd)
  return isRoot ? run('runuser', ['-u', 'postgres', '--', bin, ...args], options) : run(bin, args, options)
}

function uidOf(user) {
  return Number(execFileSync('id', ['-u', user], { encoding: 'utf8' }).trim())
}

export function initCluster(dir) {
  if (existsSync(join(dir, 'PG_VERSION'))) return false
  mkdirSync(dir, { recursive: true, mode: 0o700 })
  if (isRoot) chownSync(dir, uidOf('postgres'), Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim()))
  console.log(`[voltwright] creating a PostgreSQL cluster in ${dir}`)
  asPostgres('initdb', ['-D', dir, '-U', 'postgres', '--auth=trust', '--encoding=UTF8', '--locale=C.UTF-8'], { quiet: true })
  return true
}

export function startServer(dir, port) {
  const running = asPostgres('pg_ctl', ['-D', dir, 'status'], { quiet: true, allowFailure: true }).status === 0
  if (running) return false
  const opts = `-c listen_addresses=127.0.0.1 -c port=${port} -c unix_socket_directories='${dir}' -c max_connections=200 -c fsync=${process.env.PG_FSYNC ?? 'on'}`
  asPostgres('pg_ctl', ['-D', dir, '-l', join(dir, 'server.log'), '-o', opts, '-w', '-t', '60', 'start'], { quiet: true })
  return true
}

export function stopServer(dir) {
  asPostgres('pg_ctl', ['-D', dir, '-m', 'fast', '-w', 'stop'], { quiet: true, allowFailure: true })
}

export function psql(port, sql, db = 'postgres') {
  return run(join(pgBinDir(), 'psql'), ['-h', '127.0.0.1', '-p', String(port), '-U', 'postgres', '-d', db, '-v', 'ON_ERROR_STOP=1', '-tAc', sql], { quiet: true }).stdout.trim()
}

// The application connects as its own, non-superuser role that owns its database.
export function ensureDatabase(port) {
  if (!psql(port, "SELECT 1 FROM pg_roles WHERE rolname = 'voltwright'")) psql(port, 'CREATE ROLE voltwright LOGIN')
  if (!psql(port, "SELECT 1 FROM pg_database WHERE datname = 'voltwright'")) psql(port, 'CREATE DATABASE voltwright OWNER voltwright')
}

export function startPostgres(dir, port) {
  ensurePostgresInstalled()
  initCluster(dir)
  const started = startServer(dir, port)
  ensureDatabase(port)
  return started
}

// The same stop without blocking the caller's event loop (tests stop the server while requests flow).
export function stopServerAsync(dir) {
  const bin = join(pgBinDir(), 'pg_ctl')
  const [cmd, args] = isRoot ? ['runuser', ['-u', 'postgres', '--', bin, '-D', dir, '-m', 'fast', '-w', 'stop']] : [bin, ['-D', dir, '-m', 'fast', '-w', 'stop']]
  return new Promise((resolve) => execFile(cmd, args, () => resolve()))
}
