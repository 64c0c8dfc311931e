import { projectListSchema, projectSchema } from '@shared/api/schemas'
import { z } from 'zod'
import { request, requestVoid } from './http'

const projectBody = z.object({ project: projectSchema })

export const listProjects = () => request('/projects', projectListSchema).then((b) => b.projects)
export const getProject = (id: string) =>
  request(`/projects/${id}`, projectBody).then((b) => b.project)
export const createProject = (body: { name: string; description?: string; units?: 'si' | 'us' }) =>
  request('/projects', projectBody, { method: 'POST', body }).then((b) => b.project)
export const updateProject = (
  id: string,
  body: { name?: string; description?: string; units?: 'si' | 'us' },
) => request(`/projects/${id}`, projectBody, { method: 'PATCH', body }).then((b) => b.project)
export const deleteProject = (id: string) => requestVoid(`/projects/${id}`, { method: 'DELETE' })
