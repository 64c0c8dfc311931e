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
