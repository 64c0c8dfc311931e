import {
  organisationBodySchema,
  organisationListBodySchema,
  organisationMemberBodySchema,
  organisationMemberListBodySchema,
  type OrganisationRole,
} from '@shared/api/organisations'
import { request, requestVoid } from './http'

const base = (id: string) => `/organisations/${id}`

export const listOrganisations = () =>
  request('/organisations', organisationListBodySchema).then((b) => b.organisations)
export const createOrganisation = (name: string) =>
  request('/organisations', organisationBodySchema, { method: 'POST', body: { name } }).then(
    (b) => b.organisation,
  )
export const listOrganisationMembers = (id: string) =>
  request(`${base(id)}/members`, organisationMemberListBodySchema).then((b) => b.members)
export const addOrganisationMember = (
  id: string,
  body: { email: string; role: OrganisationRole },
) =>
  request(`${base(id)}/members`, organisationMemberBodySchema, { method: 'POST', body }).then(
    (b) => b.member,
  )
export const changeOrganisationRole = (id: string, userId: string, role: OrganisationRole) =>
  request(`${base(id)}/members/${userId}`, organisationMemberBodySchema, {
    method: 'PATCH',
    body: { role },
  }).then((b) => b.member)
export const removeOrganisationMember = (id: string, userId: string) =>
  requestVoid(`${base(id)}/members/${userId}`, { method: 'DELETE' })
