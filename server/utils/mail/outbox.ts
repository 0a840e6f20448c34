import nodemailer, { type Transporter } from 'nodemailer'
import { Op, type Transaction } from 'sequelize'
import { MailMessage, User } from '../../models'
import { useDatabase } from '../database/db'

export interface MailInput { workshopId: number | null, to: string, subject: string, text: string, html?: string }

// Mail is written to the outbox inside the caller's transaction: it goes if and only if the change commits.
export async function queueMail(transaction: Transaction, mail: MailInput | MailInput[]) {
  const list = Array.isArray(mail) ? mail : [mail]
  if (list.length) await MailMessage.bulkCreate(list.map(m => ({ ...m, html: m.html ?? null })), { transaction })
}

// The active people of a workshop who hold a role (e.g. every engineer), for addressing mail.
export async function peopleWithRole(workshopId: number, role: string, transaction?: Transaction) {
  return User.findAll({ where: { workshopId, active: true, roles: { [Op.contains]: [role] } }, transaction })
}

export function absoluteUrl(path: string) {
  return new URL(path, useRuntimeConfig().public.baseUrl).toString()
}

// NUXT_SMTP_TLS: 'none' for the local sink, 'starttls' (port 587, TLS required) or 'implicit' (port 465) for a
// mail service, with NUXT_SMTP_USER and NUXT_SMTP_PASSWORD when it asks for them (docs/deployment.md).
let transporter: Transporter | undefined
function smtp(): Transporter {
  const config = useRuntimeConfig()
  const tls = String(config.smtpTls)
  const auth = config.smtpUser ? { user: String(config.smtpUser), pass: String(config.smtpPassword) } : undefined
  transporter ??= nodemailer.createTransport({
    host: config.smtpHost, port: Number(config.smtpPort), auth, connectionTimeout: 5000, greetingTimeout: 5000,
    secure: tls === 'implicit', requireTLS: tls === 'starttls', ignoreTLS: tls !== 'starttls' && tls !== 'implicit'
  })
  return transporter
}

const MAX_ATTEMPTS = 12
const BATCH = 20

// Delivers what is due. Rows are claimed with SKIP LOCKED, so several server instances never send one twice;
// a failure waits longer each time (2 s, 4 s, 8 s … up to 10 min) and is kept, never dropped silently.
export async function deliverDueMail(): Promise<number> {
  const sequelize = useDatabase()
  let sent = 0
  await sequelize.transaction(async (transaction) => {
    const due = await MailMessage.findAll({
      where: { state: 'pending', nextAttemptAt: { [Op.lte]: new Date() } },
      order: [['id', 'ASC']], limit: BATCH, lock: transaction.LOCK.UPDATE, skipLocked: true, transaction
    })
    for (const m of due) {
      try {
        await smtp().sendMail({ from: useRuntimeConfig().mailFrom, to: m.to, subject: m.subject, text: m.text, html: m.html ?? undefined })
        await m.update({ state: 'sent', sentAt: new Date(), attempts: m.attempts + 1, lastError: null }, { transaction })
        sent++
      } catch (e) {
        const attempts = m.attempts + 1
        const delayMs = Math.min(600_000, 1000 * 2 ** attempts)
        await m.update({ attempts, lastError: String((e as Error).message).slice(0, 500), state: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending', nextAttemptAt: new Date(Date.now() + delayMs) }, { transaction })
      }
    }
  })
  return sent
}
