import { execFileSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startMailTestApp, type MailTestApp } from './helpers/mail-app.ts'
import { reviewWorld } from './helpers/review-world.ts'

let t: MailTestApp
beforeAll(async () => {
  t = await startMailTestApp()
})
afterAll(() => t.close())

/** Renames the diagram's document once through the whole-document save (one new revision). */
async function edit(w: Awaited<ReturnType<typeof reviewWorld>>) {
  const current = await w.team.editor.agent.get(w.base).expect(200)
  const { document, revision } = current.body.diagram
  const res = await w.team.editor.agent
    .put(`${w.base}/document`)
    .send({ baseRevision: revision, document: { ...document, name: `${document.name} (rev)` } })
    .expect(200)
  return res.body.revision as number
}

describe('review decisions', () => {
  it('only editors and owners submit; reviewers and owners decide; viewers only read', async () => {
    const w = await reviewWorld(t)
    await w.team.viewer.agent.post(`${w.base}/review/submissions`).send({}).expect(403)
    await w.team.reviewer.agent.post(`${w.base}/review/submissions`).send({}).expect(403)
    const before = await w.team.viewer.agent.get(`${w.base}/review`).expect(200)
    expect(before.body.review.status).toBe('not_submitted')

    // Nothing to decide before a submission.
    await w.team.reviewer.agent
      .post(`${w.base}/review/decisions`)
      .send({ decision: 'approved', revision: 0 })
      .expect(409)

    const submitted = await w.team.editor.agent
      .post(`${w.base}/review/submissions`)
      .send({ note: 'Ready' })
      .expect(201)
    expect(submitted.body.review.status).toBe('submitted')
    const rev = submitted.body.review.currentRevision as number

    await w.team.editor.agent
      .post(`${w.base}/review/decisions`)
      .send({ decision: 'approved', revision: rev })
      .expect(403)
    await w.team.viewer.agent
      .post(`${w.base}/review/decisions`)
      .send({ decision: 'approved', revision: rev })
      .expect(403)
    const approved = await w.team.reviewer.agent
      .post(`${w.base}/review/decisions`)
      .send({ decision: 'approved', revision: rev })
      .expect(201)
    expect(approved.body.review).toMatchObject({
      status: 'approved',
      latest: { kind: 'approved', revision: rev, actor: { name: 'Reviewer Person' } },
      changedSinceApproval: false,
    })
    expect(approved.body.review.history.map((h: { kind: string }) => h.kind)).toEqual([
      'approved',
      'submitted',
    ])

    const other = await reviewWorld(t, 'Other')
    await other.team.owner.agent.get(`${w.base}/review`).expect(404)
  })

  it('ties the decision to the revision: a stale revision is refused, an edit shows "changed since approval"', async () => {
    const w = await reviewWorld(t)
    const submitted = await w.team.editor.agent
      .post(`${w.base}/review/submissions`)
      .send({})
      .expect(201)
    const rev = submitted.body.review.currentRevision as number
    const next = await edit(w)
    expect(next).toBeGreaterThan(rev)
    const stale = await w.team.reviewer.agent
      .post(`${w.base}/review/decisions`)
      .send({ decision: 'approved', revision: rev })
      .expect(409)
    expect(stale.body.error.message).toContain('changed since you opened it')

    await w.team.reviewer.agent
      .post(`${w.base}/review/decisions`)
      .send({ decision: 'approved', revision: next })
      .expect(201)
    const later = await edit(w)
    const state = (await w.team.viewer.agent.get(`${w.base}/review`).expect(200)).body.review
    expect(state).toMatchObject({
      status: 'approved',
      currentRevision: later,
      changedSinceApproval: true,
    })
    expect(state.latest.revision).toBe(next)
  })

  it('requests changes with a note (400 without one), mails the editors and logs the activity', async () => {
    const w = await reviewWorld(t)
    const submitted = await w.team.editor.agent
      .post(`${w.base}/review/submissions`)
      .send({})
      .expect(201)
    const rev = submitted.body.review.currentRevision as number
    const noNote = await w.team.reviewer.agent
      .post(`${w.base}/review/decisions`)
      .send({ decision: 'changes_requested', revision: rev })
      .expect(400)
    expect(noNote.body.error.fields[0].path).toBe('note')
    const bad = await w.team.reviewer.agent
      .post(`${w.base}/review/decisions`)
      .send({ decision: 'maybe', revision: -1 })
    expect(bad.status).toBe(400)
    expect(bad.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual([
      'decision',
      'revision',
    ])

    const note = 'Size the <hot> branch & add a reducing valve'
    const res = await w.team.reviewer.agent
      .post(`${w.base}/review/decisions`)
      .send({ decision: 'changes_requested', revision: rev, note })
      .expect(201)
    expect(res.body.review).toMatchObject({ status: 'changes_requested', latest: { note } })

    for (const who of ['editor', 'owner'] as const) {
      const [mail] = await t.mailTo(w.team[who].user.email)
      expect(mail!.subject).toBe(
        'Reviewer Person requested changes to Domestic water (Millbrook Library)',
      )
      expect(mail!.text).toContain(`at revision ${rev}`)
      expect(mail!.text).toContain(note)
      expect(mail!.html).toContain('Size the &lt;hot&gt; branch &amp; add a reducing valve')
    }
    expect(await t.mailTo(w.team.viewer.user.email)).toHaveLength(0)
    expect(await t.mailTo(w.team.reviewer.user.email)).toHaveLength(0)

    const activity = await w.team.viewer.agent
      .get(`/api/projects/${w.projectId}/activity`)
      .expect(200)
    const actions = activity.body.events.map((e: { action: string }) => e.action)
    expect(actions).toContain('review.submitted')
    expect(actions).toContain('review.changes_requested')
    const decided = activity.body.events.find(
      (e: { action: string }) => e.action === 'review.changes_requested',
    )
    expect(decided.details).toMatchObject({ diagramName: 'Domestic water', revision: rev, note })
  })

  it('editors who turned review e-mail off get none', async () => {
    const w = await reviewWorld(t)
    await w.team.editor.agent
      .patch('/api/account')
      .send({ notifications: { reviews: false } })
      .expect(200)
    const submitted = await w.team.editor.agent
      .post(`${w.base}/review/submissions`)
      .send({})
      .expect(201)
    await w.team.reviewer.agent
      .post(`${w.base}/review/decisions`)
      .send({ decision: 'approved', revision: submitted.body.review.currentRevision })
      .expect(201)
    expect(await t.mailTo(w.team.owner.user.email)).toHaveLength(1)
    expect(await t.mailTo(w.team.editor.user.email)).toHaveLength(0)
  })

  it('the calculation report shows the review status', async () => {
    const w = await reviewWorld(t)
    const { reportReviewStatus } = await import('../../server/modules/reviews/reviews.service.ts')
    const ref = { projectId: w.projectId, diagramId: w.diagramId }
    expect((await reportReviewStatus(t.db, { ...ref, revision: 0 }))!.label).toBe(
      'Not yet submitted for review',
    )
    const submitted = await w.team.editor.agent
      .post(`${w.base}/review/submissions`)
      .send({})
      .expect(201)
    const rev = submitted.body.review.currentRevision as number
    await w.team.reviewer.agent
      .post(`${w.base}/review/decisions`)
      .send({ decision: 'approved', revision: rev })
      .expect(201)
    const approved = await reportReviewStatus(t.db, { ...ref, revision: rev })
    expect(approved!.label).toBe(`Approved at revision ${rev}`)
    expect(approved!.detail).toContain('Reviewer Person')
    expect((await reportReviewStatus(t.db, { ...ref, revision: rev + 1 }))!.label).toBe(
      `Changed since approval at revision ${rev}`,
    )
    // The report route is wired to this provider: the PDF of the approved revision says so.
    const res = await w.team.viewer.agent
      .get(`${w.base}/report.pdf`)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = []
        r.on('data', (c: Buffer) => chunks.push(c))
        r.on('end', () => done(null, Buffer.concat(chunks)))
      })
      .expect(200)
    const dir = mkdtempSync(join(tmpdir(), 'review-report-'))
    writeFileSync(join(dir, 'r.pdf'), res.body as Buffer)
    const text = execFileSync('/usr/bin/pdftotext', [join(dir, 'r.pdf'), '-'], { encoding: 'utf8' })
    expect(text).toContain(`Approved at revision ${rev}`)
  })
})
