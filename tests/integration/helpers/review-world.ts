import { fernhollowHallDiagram } from '../../../shared/demo/fernhollow-hall.ts'
import type { Diagram } from '../../../shared/document/model.ts'
import { projectWithTeam, type MailTestApp } from './mail-app.ts'

/** A project with one member per role and the demo diagram, for the review tests. */
export async function reviewWorld(t: MailTestApp, name = 'Millbrook Library') {
  const world = await projectWithTeam(t, name)
  const res = await world.team.owner.agent
    .post(`/api/projects/${world.projectId}/diagrams`)
    .send({ name: 'Domestic water', document: fernhollowHallDiagram })
    .expect(201)
  const diagramId = res.body.diagram.id as string
  const base = `/api/projects/${world.projectId}/diagrams/${diagramId}`
  return { ...world, diagramId, base }
}

/** A pipe whose downstream node is a leaf: removing both leaves a valid diagram. */
export function leafPipe(doc: Diagram) {
  const pipe = doc.pipes.find((p) => !doc.pipes.some((q) => q.from === p.to))
  if (!pipe) throw new Error('the demo diagram has no leaf pipe')
  return { pipe, nodeId: pipe.to }
}

/** The document without the leaf node and its pipe. */
export function withoutLeaf(doc: Diagram, pipeId: string, nodeId: string): Diagram {
  return {
    ...doc,
    nodes: doc.nodes.filter((n) => n.id !== nodeId),
    pipes: doc.pipes.filter((p) => p.id !== pipeId),
  }
}
