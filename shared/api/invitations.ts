/** Following an invitation link: shapes of /api/invitations. */
import { z } from 'zod'
import { projectRoleSchema } from '../auth/roles.ts'
import { signUpBodySchema } from './schemas.ts'

/** Tokens are 32 random bytes in base64url (43 characters). */
export const tokenSchema = z
  .string()
  .trim()
  .regex(/^[A-Za-z0-9_-]{43}$/, 'is not a valid link token; copy the whole link from the e-mail')

export const invitationPreviewSchema = z.object({
  projectId: z.string(),
  projectName: z.string(),
  organisationName: z.string(),
  email: z.string(),
  role: projectRoleSchema,
  invitedBy: z.string().nullable(),
  expiresAt: z.string(),
  /** Whether an account with the invited address exists (sign in) or not (create one). */
  accountExists: z.boolean(),
})
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>
export const invitationPreviewBodySchema = z.object({ invitation: invitationPreviewSchema })

export const acceptInvitationBodySchema = z.object({ token: tokenSchema })
// The same name and password rules as an ordinary sign-up; the e-mail comes from the invitation.
export const invitationSignUpBodySchema = signUpBodySchema
  .pick({ name: true, password: true })
  .extend({ token: tokenSchema })
export type InvitationSignUpBody = z.infer<typeof invitationSignUpBodySchema>
export const acceptedInvitationBodySchema = z.object({
  projectId: z.string(),
  role: projectRoleSchema,
})

/** Error codes of a link that cannot be used, so the client can show a clear page. */
export const LINK_ERROR_CODES = [
  'link_expired',
  'link_used',
  'link_revoked',
  'link_unknown',
] as const
