import { userSchema, type SignInBody, type SignUpBody } from '@shared/api/schemas'
import { z } from 'zod'
import { request, requestVoid } from './http'

const userBody = z.object({ user: userSchema })

export const fetchMe = () => request('/auth/me', userBody, { quiet401: true }).then((b) => b.user)
export const signIn = (body: SignInBody) =>
  request('/auth/sign-in', userBody, { method: 'POST', body, quiet401: true }).then((b) => b.user)
export const signUp = (body: SignUpBody) =>
  request('/auth/sign-up', userBody, { method: 'POST', body }).then((b) => b.user)
export const signOut = () => requestVoid('/auth/sign-out', { method: 'POST' })
