/**
 * Request and response shapes of the HTTP API, shared by the Express routers (which validate
 * requests) and the client's api modules (which parse responses).
 */
import { z } from 'zod'
import { projectRoleSchema } from '../auth/roles.ts'

export const unitSystemSchema = z.enum(['si', 'us'])

const email = () =>
  z.string().trim().toLowerCase().max(254).pipe(z.email('must be a valid e-mail address'))

/** The shortest password an account may have (the forms say so beside the field). */
export const PASSWORD_MIN_LENGTH = 10

/** A password being chosen: at sign-up, on an invitation, in a reset or a change. */
export const newPasswordSchema = () =>
  z
    .string()
    .min(PASSWORD_MIN_LENGTH, `must be at least ${PASSWORD_MIN_LENGTH} characters`)
    .max(200, 'must be at most 200 characters')

export const signUpBodySchema = z.object({
  email: email(),
  name: z.string().trim().min(1, 'is required').max(80, 'must be at most 80 characters'),
  password: newPasswordSchema(),
})
export type SignUpBody = z.infer<typeof signUpBodySchema>

export const signInBodySchema = z.object({
  email: email(),
  password: z.string().min(1, 'is required').max(200),
})
export type SignInBody = z.infer<typeof signInBodySchema>

export const userSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  color: z.string(),
  units: unitSystemSchema,
})
export type User = z.infer<typeof userSchema>

export const projectSchema = z.object({
  id: z.string(),
  name: z.string(),
  description: z.string(),
  units: unitSystemSchema,
  role: projectRoleSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
  diagramCount: z.number().int().nonnegative(),
  /** The organisation (design firm) the project belongs to. */
  organisationId: z.string(),
  organisationName: z.string(),
})
export type Project = z.infer<typeof projectSchema>
export const projectListSchema = z.object({ projects: z.array(projectSchema) })

const projectFieldsSchema = z.object({
  name: z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters'),
  description: z.string().max(2000).default(''),
  units: unitSystemSchema.default('si'),
})
export const createProjectBodySchema = projectFieldsSchema.extend({
  /** The organisation to create it in; the user's first organisation when absent. */
  organisationId: z.uuid('must be an organisation id').optional(),
})
export const updateProjectBodySchema = projectFieldsSchema
  .partial()
  .refine((b) => Object.keys(b).length > 0, 'nothing to change')

/** The JSON body of every error response. */
export const apiErrorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
  }),
})
export type ApiErrorBody = z.infer<typeof apiErrorBodySchema>
