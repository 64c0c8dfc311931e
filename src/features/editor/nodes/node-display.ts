/** Text a node shows: its title, its key value, its problem summary. Pure, so tests read it directly. */
import type { CalcIssue, Severity } from '@shared/calc/types.ts'
import type { DiagramNode, NodeKind } from '@shared/document/model.ts'
import { formatFlow, formatPressure } from '@shared/units/format.ts'
import { issueText } from '@shared/units/issue-text.ts'
import type { UnitSystem } from '@shared/units/system.ts'
import { fixtureLabel } from './fixture-info.ts'

/** Name of each node kind as the product shows it. */
export const KIND_LABELS: Record<NodeKind, string> = {
  supply: 'Supply',
  meter: 'Water meter',
  'backflow-preventer': 'Backflow preventer',
  'pressure-reducing-valve': 'Pressure-reducing valve',
  'water-heater': 'Water heater',
  junction: 'Junction',
  fixture: 'Fixture',
  equipment: 'Equipment',
}

/** The node's own label, else its fixture's catalogue label, else the kind's name. */
export function nodeTitle(node: DiagramNode): string {
  const own = node.label.trim()
  if (own !== '') return own
  return node.kind === 'fixture' ? fixtureLabel(node.fixture) : KIND_LABELS[node.kind]
}

/**
 * The one value worth reading on the node itself, in display units: supply pressure, device
 * loss, PRV set pressure, equipment flow. Fixtures show their count separately; junctions nothing.
 */
export function nodeKeyValue(node: DiagramNode, units: UnitSystem): string | null {
  switch (node.kind) {
    case 'supply':
      return formatPressure(node.pressureKPa, units)
    case 'meter':
    case 'backflow-preventer':
    case 'water-heater':
      return `loss ${formatPressure(node.lossKPa, units)}`
    case 'pressure-reducing-valve':
      return `set ${formatPressure(node.setKPa, units)}`
    case 'equipment':
      return formatFlow(node.flowLps, units)
    case 'fixture':
    case 'junction':
      return null
  }
}

/** "×6" for a battery of six identical fixtures; null for a single fixture. */
export function fixtureCountText(count: number): string | null {
  return count > 1 ? `×${count}` : null
}

/** The worst severity among the problems, or null when there are none. */
export function worstSeverity(problems: readonly CalcIssue[]): Severity | null {
  if (problems.some((p) => p.severity === 'error')) return 'error'
  return problems.length > 0 ? 'warning' : null
}

/** One line per problem, errors first, in the display units, for a title tooltip. */
export function problemSummary(problems: readonly CalcIssue[], units: UnitSystem): string {
  const ordered = [...problems].sort(
    (a, b) => Number(b.severity === 'error') - Number(a.severity === 'error'),
  )
  return ordered
    .map((p) => `${p.severity === 'error' ? 'Error' : 'Warning'}: ${issueText(p, units)}`)
    .join('\n')
}
