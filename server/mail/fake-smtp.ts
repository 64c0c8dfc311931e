import type { AddressInfo } from 'node:net'
import { SMTPServer } from 'smtp-server'
import type { Db } from '../db/knex.ts'
import { insertCapturedMail } from './captured-mail.repo.ts'
import { parseMail } from './mime.ts'

export interface FakeSmtp {
  host: string
  port: number
  close(): Promise<void>
}

/** Largest message accepted; ours are a few kilobytes. */
const MAX_MESSAGE_BYTES = 2 * 1024 * 1024

/**
 * The local stand-in for a mail provider (development and tests): a real SMTP server on
 * loopback that accepts every message and stores it in `captured_mail`.
 */
export async function startFakeSmtp(db: Db, port = 0, host = '127.0.0.1'): Promise<FakeSmtp> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: MAX_MESSAGE_BYTES,
    onData(stream, session, callback) {
      const chunks: Buffer[] = []
      stream.on('data', (chunk: Buffer) => chunks.push(chunk))
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('latin1')
        const parsed = parseMail(raw)
        const envelopeFrom = session.envelope.mailFrom
        insertCapturedMail(db, {
          mail_from: parsed.from || (envelopeFrom ? envelopeFrom.address : ''),
          recipients: session.envelope.rcptTo.map((r) => r.address),
          subject: parsed.subject,
          text: parsed.text,
          html: parsed.html,
          raw: Buffer.from(raw, 'latin1').toString('utf8'),
        }).then(
          () => callback(),
          (err: Error) => callback(err),
        )
      })
    },
  })
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject)
    server.listen(port, host, () => resolve())
  })
  const address = server.server.address() as AddressInfo
  return {
    host,
    port: address.port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  }
}
