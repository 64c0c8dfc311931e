import nodemailer from 'nodemailer'
import type { Env } from '../config/env.ts'
import { HttpError } from '../errors.ts'

export interface OutgoingMail {
  to: string
  subject: string
  text: string
  html: string
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>
}

/** The env with the local fake SMTP server as the provider (index.ts and tests use it). */
export const withFakeSmtp = (env: Env, fake: { host: string; port: number }): Env => ({
  ...env,
  SMTP_HOST: fake.host,
  SMTP_PORT: fake.port,
  SMTP_SECURE: 'false',
  SMTP_USER: undefined,
  SMTP_PASS: undefined,
})

/** Sends over SMTP as configured in the environment; a failure becomes a clear 502. */
export function createMailer(env: Env): Mailer {
  const transport = env.SMTP_HOST
    ? nodemailer.createTransport({
        host: env.SMTP_HOST,
        port: env.SMTP_PORT,
        secure: env.SMTP_SECURE === 'true',
        auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASS ?? '' } : undefined,
      })
    : null
  return {
    async send(mail) {
      if (!transport) {
        console.error('[mail] no SMTP server is configured')
        throw mailFailed()
      }
      try {
        await transport.sendMail({ from: env.MAIL_FROM, ...mail })
      } catch (err) {
        console.error('[mail] sending failed', (err as Error).message)
        throw mailFailed()
      }
    },
  }
}

const mailFailed = () =>
  new HttpError(502, 'mail_failed', 'The e-mail could not be sent; try again in a few minutes')

/** Base address for links in e-mail. */
export const appOrigin = (env: Env) =>
  (env.APP_ORIGIN ?? `http://${env.HOST}:${env.PORT}`).replace(/\/+$/, '')
