/** The signed-in user's own settings and password: shapes of /api/account and password reset. */
import { z } from 'zod'
import { newPasswordSchema, unitSystemSchema } from './schemas.ts'
import { tokenSchema } from './invitations.ts'

export const notificationSettingsSchema = z.object({
  /** E-mail when someone mentions me in a comment. */
  mentions: z.boolean(),
  /** E-mail when a review decision is made on a diagram I work on. */
  reviews: z.boolean(),
})
export type NotificationSettings = z.infer<typeof notificationSettingsSchema>
export type NotificationKind = keyof NotificationSettings

export const accountSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  color: z.string(),
  units: unitSystemSchema,
  notifications: notificationSettingsSchema,
})
export type Account = z.infer<typeof accountSchema>
export const accountBodySchema = z.object({ account: accountSchema })

export const updateAccountBodySchema = z
  .object({
    name: z.string().trim().min(1, 'is required').max(80, 'must be at most 80 characters'),
    color: z.string().regex(/^#[0-9a-fA-F]{6}$/, 'must be a colour like #3b6ea5'),
    units: unitSystemSchema,
    notifications: notificationSettingsSchema.partial(),
  })
  .partial()
  .refine((b) => Object.keys(b).length > 0, 'nothing to change')
export type UpdateAccountBody = z.infer<typeof updateAccountBodySchema>

export const changePasswordBodySchema = z.object({
  currentPassword: z.string().min(1, 'is required').max(200),
  newPassword: newPasswordSchema(),
})
export type ChangePasswordBody = z.infer<typeof changePasswordBodySchema>

export const requestPasswordResetBodySchema = z.object({
  email: z.string().trim().toLowerCase().max(254).pipe(z.email('must be a valid e-mail address')),
})
export const passwordResetPreviewBodySchema = z.object({ email: z.string() })
export const completePasswordResetBodySchema = z.object({
  token: tokenSchema,
  password: newPasswordSchema(),
})
