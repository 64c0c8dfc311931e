/**
 * The load section: fixtures served grouped by kind (count × load each), the flush valve series
 * step by step, the total. Fixture units are the same in both unit systems.
 */
import type { PipeExplanation, ServedFixture } from '@shared/calc/explain'
import { FIXTURES } from '@shared/calc/fixtures'
import { FLUSH_VALVE_SERIES } from '@shared/calc/series'
import type { LoadBasis } from '@shared/document/model'
import { fu, line, type InspectorLine } from './inspector-types'
import { describeSource } from '@shared/calc/sources'

const VIA: Record<ServedFixture['via'], string> = {
  cold: 'cold supply only',
  hot: 'hot supply only',
  both: 'cold and hot both pass here, so the total load',
}

const SERIES_NAME = { closet: 'closets', urinal: 'urinals' } as const

interface Group {
  label: string
  each: number
  via: ServedFixture['via']
  series: ServedFixture['series']
  source: string
  count: number
  load: number
  ids: string[]
}

/** Fixtures of one kind with the same load per fixture, path and source, in first-seen order. */
export function groupFixtures(fixtures: readonly ServedFixture[]): Group[] {
  const groups = new Map<string, Group>()
  for (const f of fixtures) {
    const key = [f.fixture, f.each, f.via, f.series, f.source].join('|')
    const g = groups.get(key)
    if (g) {
      g.count += f.count
      g.load += f.load
      g.ids.push(f.id)
    } else {
      const label = FIXTURES[f.fixture]?.label ?? f.fixture
      groups.set(key, { ...f, label, ids: [f.id] })
    }
  }
  return [...groups.values()]
}

// A long series reads better as "40 + 30 + 20 + 15 + 26 × 10" than as 30 terms.
function stepsText(steps: readonly number[], then: number, listed: number): string {
  const head = steps.slice(0, listed)
  const rest = steps.length - head.length
  if (rest === 0) return head.join(' + ')
  return [...head, rest === 1 ? String(then) : `${rest} × ${then}`].join(' + ')
}

function groupLine(g: Group): string {
  const nodes = `(${g.ids.join(', ')})`
  if (g.series) {
    const extra = g.load > 0 ? `, plus ${fu(g.load)} for their other fittings` : ''
    return `${g.label} × ${g.count} ${nodes}: counted in the flush valve ${g.series} series${extra}`
  }
  return `${g.label} × ${g.count} ${nodes}: ${g.count} × ${fu(g.each)} = ${fu(g.load)}, ${VIA[g.via]}`
}

/** Sentences of the load section for an explained pipe. */
export function loadLines(x: PipeExplanation, basis: LoadBasis): InspectorLine[] {
  const lines: InspectorLine[] = [
    line(
      basis === 'flush-valve-series'
        ? 'Basis: flush valve closets and urinals by their diminishing series, other fixtures by their own load.'
        : 'Basis: every fixture by its own load (no flush valve series).',
      'note',
    ),
  ]
  const groups = groupFixtures(x.fixtures)
  const connections = x.fixtures.length
  const fixtures = groups.reduce((n, g) => n + g.count, 0)
  lines.push(
    line(
      connections === 0
        ? 'No fixture is served through this pipe.'
        : `Serves ${fixtures} fixture${fixtures === 1 ? '' : 's'} on ${connections} connection${connections === 1 ? '' : 's'}:`,
    ),
  )
  for (const g of groups) {
    lines.push(line(groupLine(g)))
    lines.push(line(`Source: ${describeSource(g.source)}`, 'note'))
  }
  for (const s of x.series) {
    const rule = FLUSH_VALVE_SERIES[s.kind]
    const steps = stepsText(s.steps, rule.then, rule.steps.length)
    lines.push(
      line(
        `Flush valve ${SERIES_NAME[s.kind]}: ${s.count} on this pipe → ${steps} = ${fu(s.total)} ` +
          `(the first add ${rule.steps.join(', ')}; each further one ${rule.then})`,
      ),
    )
  }
  lines.push(line(`Load on this pipe: ${fu(x.pipe.load)}`, 'total'))
  return lines
}
