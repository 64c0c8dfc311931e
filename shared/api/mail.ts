/** Messages captured by the local fake SMTP server (development only): /api/dev/mail. */
import { z } from 'zod'

export const capturedMailSchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  receivedAt: z.string(),
})
export type CapturedMail = z.infer<typeof capturedMailSchema>
export const capturedMailListBodySchema = z.object({ messages: z.array(capturedMailSchema) })
