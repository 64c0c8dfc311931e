import { expect, type APIRequestContext } from '@playwright/test'

type Named = { id: string; name: string }

/**
 * A copy of the seeded demo diagram, made through the API as the signed-in user, so journeys that
 * edit it leave the seeded one as it is. `remove()` deletes the copy.
 */
export async function copyDemoDiagram(api: APIRequestContext) {
  const { projects } = (await (await api.get('/api/projects')).json()) as { projects: Named[] }
  const projectId = projects.find((p) => p.name === 'Fernhollow Community Hall')!.id
  const { diagrams } = (await (await api.get(`/api/projects/${projectId}/diagrams`)).json()) as {
    diagrams: Named[]
  }
  const demoId = diagrams.find((d) => d.name === 'Domestic water')!.id
  const copy = await api.post(`/api/projects/${projectId}/diagrams/${demoId}/duplicate`)
  expect(copy.ok()).toBe(true)
  const diagramId = ((await copy.json()) as { diagram: Named }).diagram.id
  return {
    projectId,
    diagramId,
    path: `/projects/${projectId}/diagrams/${diagramId}`,
    remove: () => api.delete(`/api/projects/${projectId}/diagrams/${diagramId}`),
  }
}
