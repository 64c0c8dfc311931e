/**
 * The sources, editions and tables behind the values a report used: only the fixtures, materials
 * and demand tables the diagram actually touches, each with the text the catalogues carry.
 */
import { DEMAND_TABLES } from '../calc/demand-tables.ts'
import { FIXTURES } from '../calc/fixtures.ts'
import { MATERIALS } from '../calc/materials.ts'
import type { DiagramResult } from '../calc/types.ts'
import type { Diagram } from '../document/model.ts'

/** One group of sources: what the values are, and where each set comes from. */
export interface SourceGroup {
  topic: string
  entries: string[]
}

/** The status tags the catalogues put beside their sources. */
export const STATUS_TAGS: { tag: string; meaning: string }[] = [
  { tag: 'C', meaning: 'confirmed in a public copy of the named source' },
  {
    tag: 'C*',
    meaning: 'confirmed only in a secondary copy (an adoption, handbook or reference site)',
  },
  { tag: 'M', meaning: 'from memory, not yet checked against the printed code' },
  { tag: 'X', meaning: 'our arithmetic from cited inputs' },
  {
    tag: '[Sxx]',
    meaning: 'source number in the water supply sizing reference kept with the product',
  },
]

// shared/calc/series.ts carries this in its header; the series values themselves are there.
const SERIES_SOURCE =
  'Flush valve series (closets 40, 30, 20, 15, then 10; urinals 20, 15, 10, 8, then 5): UPC ' +
  'practice, Los Angeles plan-check worksheet for UPC 2009 Tables 6-5/6-6, C* [S18]; the two ' +
  'series counted separately (M)'

/** Groups `labels` by the source text `of` gives each: "source — label, label". */
function bySource<T>(items: readonly T[], of: (item: T) => string, label: (item: T) => string) {
  const groups = new Map<string, Set<string>>()
  for (const item of items)
    groups.set(of(item), (groups.get(of(item)) ?? new Set()).add(label(item)))
  return [...groups].map(([source, labels]) => `${source} — ${[...labels].join(', ')}`)
}

/** Sources of the values used by `doc` and its `result`. */
export function reportSources(doc: Diagram, result: DiagramResult): SourceGroup[] {
  const fixtureNodes = doc.nodes.flatMap((n) => (n.kind === 'fixture' ? [n] : []))
  const specs = [...new Set(fixtureNodes.map((n) => n.fixture))].flatMap((key) =>
    FIXTURES[key] ? [FIXTURES[key]] : [],
  )
  const series = doc.settings.loadBasis === 'flush-valve-series'
  const column = (key: string) => (series ? FIXTURES[key]!.upc : FIXTURES[key]!.ipc)
  const groups: SourceGroup[] = []
  const overrides = fixtureNodes.filter((n) => n.load)
  groups.push({
    topic: `Fixture loads (${series ? 'flush valve series basis' : 'per-fixture basis'})`,
    entries: [
      ...(series && specs.some((s) => s.flushValve) ? [SERIES_SOURCE] : []),
      ...bySource(
        specs,
        (s) => column(s.key).source,
        (s) => s.label,
      ),
      ...overrides.map(
        (n) => `Load entered by the designer at ${n.id} (${n.fixture}): no catalogue source`,
      ),
    ],
  })
  groups.push({
    topic: 'Minimum flow pressure at fixtures',
    entries: [
      ...bySource(
        specs,
        (s) => s.minPressureSource,
        (s) => s.label,
      ),
      `Project minimum where no fixture value applies: a project setting`,
    ],
  })
  groups.push({
    topic: 'Minimum supply size of fixtures',
    entries: bySource(
      specs,
      (s) => s.minNominalSource,
      (s) => s.label,
    ),
  })
  const tables = new Set(Object.values(result.pipes).map((p) => p.demandTable))
  groups.push({
    topic: "Design flow (Hunter's curve)",
    entries: [...tables].map((key) => {
      const table = DEMAND_TABLES[key]
      return table ? `${table.label}: ${table.source}` : `${key}: not in the catalogue`
    }),
  })
  const materials = new Set([
    ...doc.pipes.map((p) => p.material ?? doc.settings.material),
    ...Object.values(result.pipes).map((p) => p.material),
  ])
  groups.push({
    topic: 'Pipe materials and friction',
    entries: [...materials].map((key) => {
      const m = MATERIALS[key]
      if (!m) return `${key}: not in the catalogue`
      const friction =
        doc.settings.frictionMethod === 'hazen-williams'
          ? `Hazen-Williams C ${m.hazenWilliamsC}`
          : `roughness ${m.roughnessMm} mm (Darcy-Weisbach, Swamee-Jain)`
      return `${m.label} (${m.standard}), ${friction}: ${m.source}`
    }),
  })
  groups.push({
    topic: 'Project settings',
    entries: [
      "Velocity limits, fitting allowance, minimum and maximum pressures are the designer's " +
        'settings for this project (listed under Settings); the fitting allowance has no code source.',
    ],
  })
  return groups.filter((g) => g.entries.length > 0)
}
