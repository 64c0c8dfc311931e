/**
 * The demand section: which table and curve turned the load into a flow, between which two rows
 * it was read, the equipment added and the design flow. Table rows are quoted in gpm, as printed.
 */
import { readDemand } from '@shared/calc/demand'
import { DEMAND_TABLES, type DemandPoint } from '@shared/calc/demand-tables'
import type { PipeExplanation } from '@shared/calc/explain'
import type { PipeResult } from '@shared/calc/types'
import { formatFlow } from '@shared/units/format'
import type { UnitSystem } from '@shared/units/system'
import { fu, line, type InspectorLine } from './inspector-types'
import { describeSource } from '@shared/calc/sources'

// One decimal, as the table prints its rows.
const gpm = (v: number) => `${v.toFixed(1)} gpm`
const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`
const row = (p: DemandPoint) => `${fu(p.load)} → ${gpm(p.gpm)}`

function curveLine(pipe: PipeResult): string {
  if (pipe.curve === 'flush-tank') return 'Curve: flush tank (no flush valve fixture on this pipe).'
  const parts = [
    pipe.flushValveClosets > 0 ? plural(pipe.flushValveClosets, 'flush valve closet') : '',
    pipe.flushValveUrinals > 0 ? plural(pipe.flushValveUrinals, 'flush valve urinal') : '',
  ].filter(Boolean)
  const serves = parts.length > 0 ? parts.join(' and ') : 'a flush valve fixture'
  return `Curve: flush valve (the pipe serves ${serves}).`
}

/** How the load was read from one table column, in words. */
export function readingText(column: DemandPoint[], load: number, units: UnitSystem): string {
  const reading = readDemand(column, load)
  const flow = `${gpm(reading.gpm)}${units === 'si' ? ` (${formatFlow(reading.lps, 'si')})` : ''}`
  const first = column[0]!
  const last = column.at(-1)!
  switch (reading.range) {
    case 'zero':
      return 'No fixture load, so no probable flow from fixtures.'
    case 'below-first-row':
      return first.load <= 1
        ? `${fu(load)} is below the first row (${row(first)}): read on a straight line from zero, ${flow}.`
        : `${fu(load)} is below the first row (${row(first)}); a pipe serving a flush valve carries ` +
            `at least one valve's flow, so the first row applies: ${flow}.`
    case 'beyond-last-row': {
      const prev = column.at(-2)!
      return (
        `${fu(load)} is beyond the last row (${row(last)}): the last segment from ${fu(prev.load)} ` +
        `is extended, ${flow}. Check this reading with the authority.`
      )
    }
    case 'interpolated': {
      const hit = column.find((p) => p.load === load)
      if (hit) return `${fu(load)} is a row of the table: ${flow}.`
      const upper = column.findIndex((p) => p.load > load)
      const a = column[upper - 1]!
      const b = column[upper]!
      return (
        `${fu(load)} lies between the rows ${row(a)} and ${row(b)}; ` +
        `straight-line interpolation gives ${flow}.`
      )
    }
  }
}

/** Sentences of the demand section. */
export function demandLines(x: PipeExplanation, units: UnitSystem): InspectorLine[] {
  const p = x.pipe
  const table = DEMAND_TABLES[p.demandTable]
  const lines: InspectorLine[] = [line(`Table: ${x.demandTable.label}.`), line(curveLine(p))]
  lines.push(line(`Source: ${describeSource(x.demandTable.source)}.`, 'note'))
  if (table) lines.push(line(readingText(table.columns[p.curve], p.load, units)))
  lines.push(line(`Probable flow from the fixtures: ${formatFlow(p.fixtureFlowLps, units)}.`))
  if (x.equipment.length > 0) {
    const each = x.equipment.map((e) => `${e.id} ${formatFlow(e.flowLps, units)}`).join(', ')
    lines.push(line(`Equipment added: ${each} = ${formatFlow(p.equipmentFlowLps, units)}.`))
  } else {
    lines.push(line('No equipment downstream adds a continuous flow.', 'note'))
  }
  lines.push(line(`Design flow: ${formatFlow(p.flowLps, units)}.`, 'total'))
  return lines
}
