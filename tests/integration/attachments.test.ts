import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { fernhollowHallDiagram } from '../../shared/demo/fernhollow-hall.ts'
import { startMailTestApp, type MailTestApp } from './helpers/mail-app.ts'
import { leafPipe, reviewWorld } from './helpers/review-world.ts'

let t: MailTestApp
let w: Awaited<ReturnType<typeof reviewWorld>>
let threadId: string
const { pipe } = leafPipe(fernhollowHallDiagram)
const PNG = Buffer.concat([
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
  Buffer.alloc(64, 7),
])
const PDF = Buffer.from('%PDF-1.4\n% a tiny test document\n%%EOF\n')

beforeAll(async () => {
  t = await startMailTestApp()
  w = await reviewWorld(t)
  const res = await w.team.reviewer.agent
    .post(`${w.base}/comments`)
    .send({ target: { kind: 'pipe', id: pipe.id }, body: 'See the photo' })
    .expect(201)
  threadId = res.body.thread.id
})
afterAll(() => t.close())

const url = () => `${w.base}/comments/${threadId}/attachments`

describe('comment attachments', () => {
  it('a reviewer attaches an image; every member fetches it, nobody else can', async () => {
    const res = await w.team.reviewer.agent
      .post(url())
      .field('body', 'Photo of the riser')
      .attach('file', PNG, { filename: 'riser.png', contentType: 'image/png' })
      .expect(201)
    const comment = res.body.thread.comments.at(-1)
    expect(comment.body).toBe('Photo of the riser')
    expect(comment.attachments).toEqual([
      {
        id: expect.any(String),
        fileName: 'riser.png',
        mimeType: 'image/png',
        sizeBytes: PNG.length,
      },
    ])
    const fileUrl = `/api/projects/${w.projectId}/attachments/${comment.attachments[0].id}`
    const got = await w.team.viewer.agent.get(fileUrl).buffer(true).expect(200)
    expect(got.headers['content-type']).toBe('image/png')
    expect(got.headers['x-content-type-options']).toBe('nosniff')
    expect(Buffer.compare(got.body as Buffer, PNG)).toBe(0)

    const other = await reviewWorld(t, 'Other')
    await other.team.owner.agent.get(fileUrl).expect(404)
    // Through another project the user does belong to: still not found.
    await other.team.owner.agent
      .get(`/api/projects/${other.projectId}/attachments/${comment.attachments[0].id}`)
      .expect(404)
    const anonymous = await import('supertest').then((s) => s.default(t.app))
    await anonymous.get(fileUrl).expect(401)
  })

  it('accepts a PDF (the type is read from the bytes, not the declared type)', async () => {
    const res = await w.team.editor.agent
      .post(url())
      .attach('file', PDF, { filename: 'calc.pdf', contentType: 'application/octet-stream' })
      .expect(201)
    expect(res.body.thread.comments.at(-1).attachments[0].mimeType).toBe('application/pdf')
  })

  it('refuses other types, missing files and files over 5 MB, naming the field', async () => {
    const html = await w.team.reviewer.agent
      .post(url())
      .attach('file', Buffer.from('<script>alert(1)</script>'), {
        filename: 'x.png',
        contentType: 'image/png',
      })
      .expect(400)
    expect(html.body.error.fields[0].path).toBe('file')
    const none = await w.team.reviewer.agent.post(url()).field('body', 'no file').expect(400)
    expect(none.body.error.fields[0].path).toBe('file')
    const wrongField = await w.team.reviewer.agent
      .post(url())
      .attach('picture', PNG, 'a.png')
      .expect(400)
    expect(wrongField.body.error.fields[0].path).toBe('picture')
    const big = Buffer.concat([PNG, Buffer.alloc(5 * 1024 * 1024)])
    const tooBig = await w.team.reviewer.agent.post(url()).attach('file', big, 'big.png')
    expect(tooBig.status).toBe(413)
    expect(tooBig.body.error.fields[0].path).toBe('file')
  })

  it('a viewer may not attach; a stranger gets 404', async () => {
    await w.team.viewer.agent.post(url()).attach('file', PNG, 'a.png').expect(403)
    const other = await reviewWorld(t, 'Third')
    await other.team.owner.agent.post(url()).attach('file', PNG, 'a.png').expect(404)
  })
})
