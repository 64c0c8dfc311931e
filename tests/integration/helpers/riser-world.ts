import { addMember } from '../../../server/modules/projects/projects.repo.ts'
import { createDiagramAt, signUpAt, type Session } from './realtime-http.ts'
import { startRealtimeServer, type RealtimeTestServer } from './realtime-server.ts'
import { SyncClient } from './realtime-sync-client.ts'
import { smallRiser } from './small-riser.ts'

/** A realtime server with an owner, an editor and a reviewer on one small riser diagram. */
export interface RiserWorld {
  srv: RealtimeTestServer
  owner: Session
  editor: Session
  reviewer: Session
  projectId: string
  diagramId: string
  /** A co-editing client of `session` on the diagram, closed by `close`. */
  client(session: Session): SyncClient
  close(): Promise<void>
}

/** Per-socket limits are low (50/s, burst 60) so that the tests can reach them. */
export async function startRiserWorld(): Promise<RiserWorld> {
  const srv = await startRealtimeServer({ REALTIME_RATE: '50', REALTIME_BURST: '60' })
  const owner = await signUpAt(srv.url, 'Orla Owner')
  const editor = await signUpAt(srv.url, 'Eli Editor')
  const reviewer = await signUpAt(srv.url, 'Ravi Reviewer')
  const { projectId, diagramId } = await createDiagramAt(srv.url, owner, smallRiser)
  await addMember(srv.db, projectId, editor.user.id, 'editor')
  await addMember(srv.db, projectId, reviewer.user.id, 'reviewer')
  const clients: SyncClient[] = []
  return {
    srv,
    owner,
    editor,
    reviewer,
    projectId,
    diagramId,
    client(session) {
      const c = new SyncClient(srv.url, session.cookie, diagramId)
      clients.push(c)
      return c
    },
    async close() {
      for (const c of clients) c.close()
      await srv.close()
    },
  }
}
