import { capturedMailListBodySchema } from '@shared/api/mail'
import { z } from 'zod'
import { request } from './http'

export const mailboxAccess = () =>
  request('/dev/mail/access', z.object({ available: z.boolean() })).then((b) => b.available)
export const listCapturedMail = () =>
  request('/dev/mail', capturedMailListBodySchema).then((b) => b.messages)
