// Set-up shared by `npm start` and `npm test`: dependencies, build, session secret, hosted-service stand-ins.
import { createHash, randomBytes } from 'node:crypto'
import { existsSync, readFileSync, writeFileSync, readdirSync, statSync, mkdirSync } from 'node:fs'
import { join, relative } from 'node:path'
import { root } from './config.mjs'
import { runAsync, startChild } from './processes.mjs'
import { openHistoryForMigrations, protectHistory } from './history-guard.mjs'

function hashFiles(paths) {
  const h = createHash('sha256')
  const walk = (p) => {
    if (!existsSync(p)) return
    const s = statSync(p)
    if (s.isDirectory()) { for (const f of readdirSync(p).sort()) walk(join(p, f)); return }
    h.update(relative(root, p)); h.update(readFileSync(p))
  }
  for (const p of paths) walk(join(root, p))
  return h.digest('hex')
}

export async function ensureDependencies() {
  const lockHash = hashFiles(['package-lock.json'])
  const marker = join(root, 'node_modules', '.voltwright-lock')
  if (existsSync(marker) && readFileSync(marker, 'utf8') === lockHash) return
  console.log('[voltwright] installing dependencies (npm ci)')
  await runAsync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root })
  writeFileSync(marker, lockHash)
}

const buildInputs = ['app', 'server', 'shared', 'public', 'migrations', 'seeders', 'nuxt.config.ts', 'tailwind.config.ts', 'package-lock.json', 'tsconfig.json']

export async function ensureBuild() {
  const hash = hashFiles(buildInputs)
  const marker = join(root, '.output', '.voltwright-build')
  if (existsSync(marker) && readFileSync(marker, 'utf8') === hash) return
  console.log('[voltwright] building the product (nuxt build)')
  await runAsync('npx', ['nuxt', 'build'], { cwd: root, env: { ...process.env, NODE_ENV: 'production' } })
  writeFileSync(marker, hash)
}

// Kept in the data folder so that sessions survive a restart.
export function sessionPassword(dataDir) {
  const file = join(dataDir, 'session-password')
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 })
  return readFileSync(file, 'utf8').trim()
}

export function startMailSink(config, options = {}) {
  const bin = join(root, 'node_modules', '.bin', 'maildev')
  return startChild('maildev', bin, ['--smtp', String(config.smtpPort), '--web', String(config.mailWebPort), '--ip', '127.0.0.1', '--web-ip', '127.0.0.1', '--silent'], options)
}

export function startObjectStore(config, options = {}) {
  const dir = join(config.dataDir, 's3')
  mkdirSync(dir, { recursive: true })
  const bin = join(root, 'node_modules', '.bin', 's3rver')
  return startChild('s3rver', bin, ['-d', dir, '-a', '127.0.0.1', '-p', String(config.s3Port), '--silent', '--configure-bucket', 'voltwright'], options)
}

// Schema changes run with the audit history owner's rights, handed back as soon as they finish.
export async function runDbScript(config, env, ...args) {
  const changesSchema = args[0] === 'migrate' || args[0] === 'down'
  if (changesSchema) openHistoryForMigrations(config.pgPort)
  try {
    await runAsync(join(root, 'node_modules', '.bin', 'tsx'), [join(root, 'scripts', 'db.ts'), ...args], { cwd: root, env })
  } finally {
    if (changesSchema) protectHistory(config.pgPort)
  }
}
