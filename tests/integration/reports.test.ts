import { execFileSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import express from 'express'
import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { addMember } from '../../server/modules/projects/projects.repo.ts'
import { reportsRouter } from '../../server/modules/reports/reports.router.ts'
import { computeDiagram } from '../../shared/calc/compute.ts'
import { fernhollowHallDiagram } from '../../shared/demo/fernhollow-hall.ts'
import { nominalToDn } from '../../shared/units/nominal.ts'
import { signUp, startTestApp, type TestApp } from './helpers/test-app.ts'

let t: TestApp
let editor: supertest.Agent
let viewer: supertest.Agent
let stranger: supertest.Agent
let projectId: string
let diagramId: string
let ownerId: string
const dir = mkdtempSync(join(tmpdir(), 'tributary-report-'))
const reportUrl = () => `/api/projects/${projectId}/diagrams/${diagramId}/report.pdf`

/** Reads a PDF's text with poppler's pdftotext, keeping the layout of table rows. */
function pdfText(pdf: Buffer, name: string): string {
  const file = join(dir, name)
  writeFileSync(file, pdf)
  return execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' })
}

const binary = (res: supertest.Response, done: (e: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = []
  res.on('data', (c: Buffer) => chunks.push(c))
  res.on('end', () => done(null, Buffer.concat(chunks)))
}

beforeAll(async () => {
  t = startTestApp()
  editor = supertest.agent(t.app)
  ownerId = (await signUp(editor, 'Blair Designer')).id
  projectId = (
    await editor.post('/api/projects').send({ name: 'Fernhollow Community Hall', units: 'si' })
  ).body.project.id
  diagramId = (
    await editor
      .post(`/api/projects/${projectId}/diagrams`)
      .send({ name: 'Domestic water', document: fernhollowHallDiagram })
      .expect(201)
  ).body.diagram.id
  viewer = supertest.agent(t.app)
  const viewerUser = await signUp(viewer, 'Vera Reviewer')
  await addMember(t.db, projectId, viewerUser.id, 'viewer')
  stranger = supertest.agent(t.app)
  await signUp(stranger, 'Sam Stranger')
})
afterAll(() => t.close())

describe('GET .../report.pdf', () => {
  it('answers a PDF whose text holds the title block, the schedule, pressures, sources and the caution', async () => {
    const res = await viewer.get(reportUrl()).buffer(true).parse(binary).expect(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    expect(res.headers['content-disposition']).toContain('Domestic water r0 report.pdf')
    const pdf = res.body as Buffer
    expect(Number(res.headers['content-length'])).toBe(pdf.length)
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-')
    const text = pdfText(pdf, 'demo.pdf')
    const info = execFileSync('/usr/bin/pdfinfo', [join(dir, 'demo.pdf')], { encoding: 'utf8' })
    const pages = Number(/Pages:\s+(\d+)/.exec(info)![1])
    expect(pages).toBeGreaterThanOrEqual(4)

    for (const heading of [
      'Pipe schedule',
      'Node pressures',
      'Problems',
      'Sources of the values used',
      'Diagram',
    ]) {
      expect(text).toContain(heading)
    }
    expect(text).toContain('Fernhollow Community Hall')
    expect(text).toMatch(/Revision\s+0/)
    expect(text).toContain('Not yet submitted for review')
    expect(text).toContain('Flush valve series')
    // Every pipe of the diagram is a schedule row with the size the calculation chose.
    const result = computeDiagram(fernhollowHallDiagram)
    for (const pipe of fernhollowHallDiagram.pipes) {
      const line = text.split('\n').find((l) => l.trimStart().startsWith(`${pipe.id} `))
      expect(line, `schedule row of ${pipe.id}`).toBeDefined()
      expect(line).toContain(`DN${nominalToDn(result.pipes[pipe.id]!.nominal!)}`)
    }
    // Sources with edition and table, as the catalogues carry them.
    expect(text).toContain('UPC 2018 Table A 103.1')
    expect(text).toContain('IPC Table E103.3(3)')
    expect(text).toContain('CDA Copper Tube Handbook Table 14.2f')
    // The caution on every page footer.
    const caution =
      'Results are a design aid. The plumbing code adopted by the local authority and a licensed professional decide.'
    const flat = text.replace(/\s+/g, ' ')
    expect(flat.split(caution).length - 1).toBeGreaterThanOrEqual(pages)
    expect(text).toContain(`Page ${pages} of ${pages}`)
  })

  it('embeds IBM Plex Sans and no other font', () => {
    const fonts = execFileSync('/usr/bin/pdffonts', [join(dir, 'demo.pdf')], { encoding: 'utf8' })
    const rows = fonts.split('\n').slice(2).filter(Boolean)
    expect(rows.length).toBeGreaterThan(0)
    for (const row of rows) {
      expect(row).toMatch(/IBMPlexSans/)
      expect(row).toMatch(/\byes\s+yes\s+yes\b/)
    }
  })

  it('uses US units for a US project', async () => {
    await editor.patch(`/api/projects/${projectId}`).send({ units: 'us' }).expect(200)
    const res = await viewer.get(reportUrl()).buffer(true).parse(binary).expect(200)
    const text = pdfText(res.body as Buffer, 'us.pdf')
    expect(text).toContain('(gpm)')
    expect(text).toContain('(ft/s)')
    expect(text).toContain('US (gpm, psi, ft, in)')
    await editor.patch(`/api/projects/${projectId}`).send({ units: 'si' }).expect(200)
  })

  it('is not there for someone outside the project, nor signed out, nor for a bad id', async () => {
    await stranger.get(reportUrl()).expect(404)
    await supertest(t.app).get(reportUrl()).expect(401)
    await viewer.get(`/api/projects/${projectId}/diagrams/not-a-uuid/report.pdf`).expect(404)
    const missing = await viewer
      .get(`/api/projects/${projectId}/diagrams/00000000-0000-4000-8000-000000000000/report.pdf`)
      .expect(404)
    expect(missing.body.error.message).toBe('No such diagram in this project')
  })

  it('prints the review status a provider gives', async () => {
    const app = express()
    app.use((req, _res, next) => {
      ;(req as { user?: unknown }).user = { id: ownerId }
      next()
    })
    app.use(
      '/api/projects/:projectId/diagrams',
      reportsRouter(t.db, {
        reviewStatus: async (_db, ref) => ({
          label: 'Approved',
          detail: `Approved by the plan reviewer at revision ${ref.revision}`,
        }),
      }),
    )
    const res = await supertest(app).get(reportUrl()).buffer(true).parse(binary).expect(200)
    const text = pdfText(res.body as Buffer, 'reviewed.pdf').replace(/\s+/g, ' ')
    expect(text).toContain('Review status: Approved')
    expect(text).toContain('Approved by the plan reviewer at revision 0')
    expect(text).not.toContain('Not yet submitted')
  })
})
