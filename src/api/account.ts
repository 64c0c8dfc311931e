import {
  accountBodySchema,
  passwordResetPreviewBodySchema,
  type ChangePasswordBody,
  type UpdateAccountBody,
} from '@shared/api/account'
import { z } from 'zod'
import { request, requestVoid } from './http'

export const fetchAccount = () => request('/account', accountBodySchema).then((b) => b.account)
export const updateAccount = (body: UpdateAccountBody) =>
  request('/account', accountBodySchema, { method: 'PATCH', body }).then((b) => b.account)
export const changePassword = (body: ChangePasswordBody) =>
  requestVoid('/account/password', { method: 'POST', body })
export const requestPasswordReset = (email: string) =>
  request('/auth/password-reset/request', z.object({ ok: z.boolean() }), {
    method: 'POST',
    body: { email },
  })
export const previewPasswordReset = (token: string) =>
  request(`/auth/password-reset/${encodeURIComponent(token)}`, passwordResetPreviewBodySchema, {
    quiet401: true,
  })
export const completePasswordReset = (token: string, password: string) =>
  requestVoid('/auth/password-reset/complete', {
    method: 'POST',
    body: { token, password },
    quiet401: true,
  })
