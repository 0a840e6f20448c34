// Ports, folders and URLs shared by `npm start` and `npm test`; every value can be set from the environment.
import { resolve } from 'node:path'

export const root = resolve(import.meta.dirname, '..', '..')

export function stackConfig(defaults) {
  const env = (name) => process.env[name] || String(defaults[name])
  const dataDir = resolve(root, env('DATA_DIR'))
  const config = {
    port: Number(env('PORT')),
    dataDir,
    pgPort: Number(env('PG_PORT')),
    s3Port: Number(env('S3_PORT')),
    smtpPort: Number(env('SMTP_PORT')),
    mailWebPort: Number(env('MAIL_WEB_PORT'))
  }
  config.baseUrl = `http://localhost:${config.port}`
  config.databaseUrl = `postgres://voltwright@127.0.0.1:${config.pgPort}/voltwright`
  config.adminDatabaseUrl = `postgres://postgres@127.0.0.1:${config.pgPort}/voltwright`
  return config
}

// The environment the built server and the database scripts run with.
export function serverEnv(config, sessionPassword) {
  return {
    ...process.env,
    NODE_ENV: 'production',
    PORT: String(config.port),
    HOST: process.env.HOST || '0.0.0.0',
    NUXT_SESSION_PASSWORD: sessionPassword,
    NUXT_DATABASE_URL: config.databaseUrl,
    NUXT_PUBLIC_BASE_URL: config.baseUrl,
    NUXT_S3_ENDPOINT: `http://127.0.0.1:${config.s3Port}`,
    NUXT_SMTP_PORT: String(config.smtpPort),
    DATABASE_URL: config.databaseUrl,
    AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true'
  }
}
