import { z } from 'zod'

/** Environment read once at start-up; a bad value stops the server with the variable named. */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  DATABASE_URL: z.string().default('postgres://postgres@127.0.0.1:54329/tributary'),
  SESSION_SECRET: z.string().min(16).default('tributary-development-secret-change-me'),
  /** Sign-in attempts allowed per client address in a 15-minute window. */
  SIGN_IN_LIMIT: z.coerce.number().int().positive().default(20),
  /** Public origin of the app (links in e-mail, socket Origin check). */
  APP_ORIGIN: z.string().optional(),
  /** Co-editing limits (server/realtime): largest socket message, bytes. */
  REALTIME_MAX_BYTES: z.coerce
    .number()
    .int()
    .min(1024)
    .default(256 * 1024),
  /** Ops and presence messages a socket may sustain per second, and the burst it may send. */
  REALTIME_RATE: z.coerce.number().positive().default(200),
  REALTIME_BURST: z.coerce.number().int().positive().default(400),
  /** Largest revision gap answered with missed ops on join; beyond it a snapshot is sent. */
  REALTIME_CATCH_UP_OPS: z.coerce.number().int().min(0).default(200),
  /** Outgoing mail. Without SMTP_HOST the server starts a local fake SMTP server (see README). */
  SMTP_HOST: z.string().min(1).optional(),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  /** "true" for implicit TLS (usually port 465); otherwise STARTTLS is used when offered. */
  SMTP_SECURE: z.enum(['true', 'false']).default('false'),
  MAIL_FROM: z.string().default('Tributary <no-reply@tributary.example.test>'),
  /** Port of the local fake SMTP server; 0 picks a free one (each process runs its own). */
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(0),
})

export type Env = z.infer<typeof envSchema>

export function readEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source)
  if (!parsed.success) {
    const detail = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')
    throw new Error(`Invalid environment: ${detail}`)
  }
  if (parsed.data.NODE_ENV === 'production' && !source.SESSION_SECRET) {
    throw new Error('Invalid environment: SESSION_SECRET must be set in production')
  }
  return parsed.data
}
