import { auditEventListBodySchema } from '@shared/api/audit'
import { request } from './http'

export const listActivity = (projectId: string) =>
  request(`/projects/${projectId}/activity`, auditEventListBodySchema).then((b) => b.events)
