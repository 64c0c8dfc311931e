import {
  acceptedInvitationBodySchema,
  invitationPreviewBodySchema,
  type InvitationSignUpBody,
} from '@shared/api/invitations'
import { userSchema } from '@shared/api/schemas'
import { request } from './http'

export const previewInvitation = (token: string) =>
  request(`/invitations/${encodeURIComponent(token)}`, invitationPreviewBodySchema, {
    quiet401: true,
  }).then((b) => b.invitation)
export const acceptInvitation = (token: string) =>
  request('/invitations/accept', acceptedInvitationBodySchema, { method: 'POST', body: { token } })
export const signUpFromInvitation = (body: InvitationSignUpBody) =>
  request('/invitations/sign-up', acceptedInvitationBodySchema.extend({ user: userSchema }), {
    method: 'POST',
    body,
  })
