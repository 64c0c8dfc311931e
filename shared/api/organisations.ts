/** Organisations (design firms): shapes of /api/organisations. */
import { z } from 'zod'

export const organisationRoleSchema = z.enum(['admin', 'member'])
export type OrganisationRole = z.infer<typeof organisationRoleSchema>

export const organisationSchema = z.object({
  id: z.string(),
  name: z.string(),
  /** The signed-in user's role in it. */
  role: organisationRoleSchema,
  memberCount: z.number().int().nonnegative(),
  projectCount: z.number().int().nonnegative(),
})
export type Organisation = z.infer<typeof organisationSchema>
export const organisationListBodySchema = z.object({ organisations: z.array(organisationSchema) })
export const organisationBodySchema = z.object({ organisation: organisationSchema })

export const organisationMemberSchema = z.object({
  userId: z.string(),
  name: z.string(),
  email: z.string(),
  color: z.string(),
  role: organisationRoleSchema,
  joinedAt: z.string(),
})
export type OrganisationMember = z.infer<typeof organisationMemberSchema>
export const organisationMemberListBodySchema = z.object({
  members: z.array(organisationMemberSchema),
})
export const organisationMemberBodySchema = z.object({ member: organisationMemberSchema })

export const createOrganisationBodySchema = z.object({
  name: z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters'),
})
export const addOrganisationMemberBodySchema = z.object({
  email: z.string().trim().toLowerCase().max(254).pipe(z.email('must be a valid e-mail address')),
  role: organisationRoleSchema.default('member'),
})
export type AddOrganisationMemberBody = z.infer<typeof addOrganisationMemberBodySchema>
export const changeOrganisationRoleBodySchema = z.object({ role: organisationRoleSchema })
