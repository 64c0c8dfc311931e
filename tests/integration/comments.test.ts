import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { fernhollowHallDiagram } from '../../shared/demo/fernhollow-hall.ts'
import { startMailTestApp, type MailTestApp } from './helpers/mail-app.ts'
import { leafPipe, reviewWorld, withoutLeaf } from './helpers/review-world.ts'

let t: MailTestApp
let w: Awaited<ReturnType<typeof reviewWorld>>
const { pipe, nodeId } = leafPipe(fernhollowHallDiagram)

beforeAll(async () => {
  t = await startMailTestApp()
  w = await reviewWorld(t)
})
afterAll(() => t.close())

describe('comment threads', () => {
  it('a reviewer pins a thread to a pipe; every member, viewers included, reads it', async () => {
    const res = await w.team.reviewer.agent
      .post(`${w.base}/comments`)
      .send({ target: { kind: 'pipe', id: pipe.id }, body: 'Is 15 mm enough for this branch?' })
      .expect(201)
    const thread = res.body.thread
    expect(thread.target).toEqual({ kind: 'pipe', id: pipe.id })
    expect(thread.orphaned).toBe(false)
    expect(thread.comments).toHaveLength(1)
    expect(thread.comments[0].author.name).toBe('Reviewer Person')

    const list = await w.team.viewer.agent.get(`${w.base}/comments`).expect(200)
    expect(list.body.threads.map((x: { id: string }) => x.id)).toContain(thread.id)
  })

  it('a viewer may not comment, reply or resolve (403); a stranger sees nothing (404)', async () => {
    const created = await w.team.editor.agent
      .post(`${w.base}/comments`)
      .send({ target: { kind: 'node', id: nodeId }, body: 'Check the outlet height' })
      .expect(201)
    const id = created.body.thread.id
    const viewer = w.team.viewer.agent
    await viewer
      .post(`${w.base}/comments`)
      .send({ target: { kind: 'node', id: nodeId }, body: 'x' })
      .expect(403)
    await viewer.post(`${w.base}/comments/${id}/replies`).send({ body: 'x' }).expect(403)
    await viewer.patch(`${w.base}/comments/${id}`).send({ resolved: true }).expect(403)

    const other = await reviewWorld(t, 'Other Hall')
    await other.team.owner.agent.get(`${w.base}/comments`).expect(404)
    await other.team.owner.agent
      .post(`${w.base}/comments/${id}/replies`)
      .send({ body: 'x' })
      .expect(404)
    // A thread of another diagram is not reachable through this one.
    await other.team.owner.agent
      .post(`${other.base}/comments/${id}/replies`)
      .send({ body: 'x' })
      .expect(404)
  })

  it('refuses bad bodies with 400 naming the field', async () => {
    const agent = w.team.reviewer.agent
    const empty = await agent
      .post(`${w.base}/comments`)
      .send({ target: { kind: 'pipe', id: pipe.id }, body: '  ' })
    expect(empty.status).toBe(400)
    expect(empty.body.error.fields.map((f: { path: string }) => f.path)).toContain('body')
    const kind = await agent
      .post(`${w.base}/comments`)
      .send({ target: { kind: 'valve', id: pipe.id }, body: 'x' })
    expect(kind.status).toBe(400)
    expect(kind.body.error.fields[0].path).toBe('target.kind')
    const missing = await agent
      .post(`${w.base}/comments`)
      .send({ target: { kind: 'pipe', id: 'no-such' }, body: 'x' })
    expect(missing.status).toBe(400)
    expect(missing.body.error.fields[0].path).toBe('target.id')
    const long = await agent
      .post(`${w.base}/comments`)
      .send({ target: { kind: 'pipe', id: pipe.id }, body: 'x'.repeat(4001) })
    expect(long.status).toBe(400)
    const mention = await agent
      .post(`${w.base}/comments`)
      .send({ target: { kind: 'pipe', id: pipe.id }, body: 'x', mentions: ['not-a-uuid'] })
    expect(mention.body.error.fields[0].path).toBe('mentions.0')
    const resolved = await agent
      .patch(`${w.base}/comments/00000000-0000-4000-8000-000000000000`)
      .send({ resolved: 'yes' })
    expect(resolved.status).toBe(400)
    expect(resolved.body.error.fields[0].path).toBe('resolved')
  })

  it('stores text as given: markup is kept as plain characters, never interpreted', async () => {
    const body = '<img src=x onerror=alert(1)> & "quotes"'
    const res = await w.team.reviewer.agent
      .post(`${w.base}/comments`)
      .send({ target: { kind: 'pipe', id: pipe.id }, body })
      .expect(201)
    expect(res.body.thread.comments[0].body).toBe(body)
  })

  it('replies, resolves and reopens; anyone who may comment can resolve', async () => {
    const created = await w.team.reviewer.agent
      .post(`${w.base}/comments`)
      .send({ target: { kind: 'pipe', id: pipe.id }, body: 'Velocity looks high' })
      .expect(201)
    const id = created.body.thread.id
    const replied = await w.team.editor.agent
      .post(`${w.base}/comments/${id}/replies`)
      .send({ body: 'Upsized to 20 mm' })
      .expect(201)
    expect(replied.body.thread.comments.map((c: { body: string }) => c.body)).toEqual([
      'Velocity looks high',
      'Upsized to 20 mm',
    ])
    const resolved = await w.team.editor.agent
      .patch(`${w.base}/comments/${id}`)
      .send({ resolved: true })
      .expect(200)
    expect(resolved.body.thread.resolvedAt).not.toBeNull()
    expect(resolved.body.thread.resolvedBy.name).toBe('Editor Person')
    const reopened = await w.team.reviewer.agent
      .patch(`${w.base}/comments/${id}`)
      .send({ resolved: false })
      .expect(200)
    expect(reopened.body.thread.resolvedAt).toBeNull()
    expect(reopened.body.thread.resolvedBy).toBeNull()
  })

  it('mentions e-mail project members (escaped HTML), not the author, and respect opt-outs', async () => {
    const body = 'Please check <b>this</b> @Editor Person @Owner Person'
    await w.team.reviewer.agent
      .post(`${w.base}/comments`)
      .send({
        target: { kind: 'pipe', id: pipe.id },
        body,
        mentions: [w.team.editor.user.id, w.team.owner.user.id, w.team.reviewer.user.id],
      })
      .expect(201)
    const [mail] = await t.mailTo(w.team.editor.user.email)
    expect(mail!.subject).toBe(
      'Reviewer Person mentioned you on Domestic water (Millbrook Library)',
    )
    expect(mail!.text).toContain('> Please check <b>this</b>')
    expect(mail!.text).toContain(
      `http://tributary.test/projects/${w.projectId}/diagrams/${w.diagramId}`,
    )
    expect(mail!.html).toContain('Please check &lt;b&gt;this&lt;/b&gt;')
    expect(mail!.html).not.toContain('<b>this</b>')
    expect(await t.mailTo(w.team.owner.user.email)).toHaveLength(1)
    expect(await t.mailTo(w.team.reviewer.user.email)).toHaveLength(0)

    // The owner turns mention e-mail off: the next mention stays silent for them.
    await w.team.owner.agent
      .patch('/api/account')
      .send({ notifications: { mentions: false } })
      .expect(200)
    await w.team.reviewer.agent
      .post(`${w.base}/comments`)
      .send({
        target: { kind: 'pipe', id: pipe.id },
        body: 'again',
        mentions: [w.team.owner.user.id],
      })
      .expect(201)
    expect(await t.mailTo(w.team.owner.user.email)).toHaveLength(1)
  })

  it('refuses a mention of someone outside the project', async () => {
    const other = await reviewWorld(t, 'Elsewhere')
    const res = await w.team.reviewer.agent
      .post(`${w.base}/comments`)
      .send({
        target: { kind: 'pipe', id: pipe.id },
        body: 'x',
        mentions: [other.team.editor.user.id],
      })
      .expect(400)
    expect(res.body.error.fields[0]).toEqual({
      path: 'mentions.0',
      message: 'is not a member of this project',
    })
    expect(await t.mailTo(other.team.editor.user.email)).toHaveLength(0)
  })

  it('keeps a thread readable, marked orphaned, when its node is deleted', async () => {
    const created = await w.team.reviewer.agent
      .post(`${w.base}/comments`)
      .send({ target: { kind: 'node', id: nodeId }, body: 'This fixture is mislabelled' })
      .expect(201)
    const current = await w.team.owner.agent.get(w.base).expect(200)
    const doc = withoutLeaf(current.body.diagram.document, pipe.id, nodeId)
    await w.team.editor.agent
      .put(`${w.base}/document`)
      .send({ baseRevision: current.body.diagram.revision, document: doc })
      .expect(200)
    const list = await w.team.viewer.agent.get(`${w.base}/comments`).expect(200)
    const thread = list.body.threads.find((x: { id: string }) => x.id === created.body.thread.id)
    expect(thread.orphaned).toBe(true)
    expect(thread.comments[0].body).toBe('This fixture is mislabelled')
    // It still takes replies, but no new thread can be pinned to the missing node.
    await w.team.editor.agent
      .post(`${w.base}/comments/${thread.id}/replies`)
      .send({ body: 'Removed it' })
      .expect(201)
    await w.team.editor.agent
      .post(`${w.base}/comments`)
      .send({ target: { kind: 'node', id: nodeId }, body: 'x' })
      .expect(400)
  })
})
