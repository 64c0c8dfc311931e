/**
 * The calculation report's content, as pure data: everything the PDF prints, computed from the
 * document, its result and the project record. The renderer only lays it out.
 */
import type { CalcIssue, DiagramResult } from '../calc/types.ts'
import type { Diagram } from '../document/model.ts'
import type { UnitSystem } from '../units/system.ts'
import { reportNodes } from './report-nodes.ts'
import { reportPicture, type ReportPicture } from './report-picture.ts'
import { reportSchedule } from './report-schedule.ts'
import { loadBasisText, settingsRows, type LabelledValue } from './report-settings.ts'
import { reportSources, STATUS_TAGS, type SourceGroup } from './report-sources.ts'
import type { ReportTable } from './report-table.ts'
import { DESIGN_AID_CAUTION, type ReviewStatus } from './review-status.ts'

/** What the report needs to know besides the document. */
export interface ReportInput {
  doc: Diagram
  result: DiagramResult
  project: { name: string; description: string; units: UnitSystem }
  diagram: { name: string; revision: number; updatedAt: string; updatedBy: string | null }
  review: ReviewStatus
  /** ISO time the report is made; passed in so the model stays a pure function. */
  generatedAt: string
}

export interface ReportModel {
  title: string
  /** Project, diagram, revision, dates: the title block. */
  identity: LabelledValue[]
  review: ReviewStatus
  caution: string
  units: UnitSystem
  summary: LabelledValue[]
  settings: LabelledValue[]
  loadBasis: { name: string; text: string }
  picture: ReportPicture
  schedule: ReportTable
  nodes: ReportTable
  problems: CalcIssue[]
  sources: SourceGroup[]
  statusTags: typeof STATUS_TAGS
}

const stamp = (iso: string) => iso.replace('T', ' ').replace(/:\d\d(\.\d+)?Z$/, ' UTC')

/**
 * Builds the report content.
 * @example buildReportModel({ doc, result: computeDiagram(doc), project, diagram, review: NOT_SUBMITTED, generatedAt })
 */
export function buildReportModel(input: ReportInput): ReportModel {
  const { doc, result, project, diagram } = input
  const units = project.units
  const errors = result.issues.filter((i) => i.severity === 'error').length
  const fixtures = doc.nodes.reduce((n, node) => n + (node.kind === 'fixture' ? node.count : 0), 0)
  return {
    title: 'Domestic water supply: calculation report',
    identity: [
      { label: 'Project', value: project.name },
      ...(project.description ? [{ label: 'Description', value: project.description }] : []),
      { label: 'Diagram', value: diagram.name },
      { label: 'Revision', value: String(diagram.revision) },
      {
        label: 'Last saved',
        value: `${stamp(diagram.updatedAt)}${diagram.updatedBy ? ` by ${diagram.updatedBy}` : ''}`,
      },
      { label: 'Report made', value: stamp(input.generatedAt) },
      { label: 'Units', value: units === 'si' ? 'SI (L/s, kPa, m, mm)' : 'US (gpm, psi, ft, in)' },
    ],
    review: input.review,
    caution: DESIGN_AID_CAUTION,
    units,
    summary: [
      { label: 'Pipes', value: String(doc.pipes.length) },
      { label: 'Nodes', value: String(doc.nodes.length) },
      { label: 'Fixtures (counting batteries)', value: String(fixtures) },
      {
        label: 'Problems',
        value: `${errors} error${errors === 1 ? '' : 's'}, ${result.issues.length - errors} warning${result.issues.length - errors === 1 ? '' : 's'}`,
      },
      {
        label: 'Calculation',
        value: result.ok ? 'complete' : 'has errors: results marked "not computed" are missing',
      },
    ],
    settings: settingsRows(doc.settings, units),
    loadBasis: loadBasisText(doc.settings.loadBasis),
    picture: reportPicture(doc, result, units),
    schedule: reportSchedule(doc, result, units),
    nodes: reportNodes(doc, result, units),
    problems: [...result.issues].sort((a, b) =>
      a.severity === b.severity ? 0 : a.severity === 'error' ? -1 : 1,
    ),
    sources: reportSources(doc, result),
    statusTags: STATUS_TAGS,
  }
}
