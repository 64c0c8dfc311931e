/** The text of a pipe's label and its tooltip, from the pipe, its live result and its problems. */
import type { PipeEdgeData } from '@/features/editor/canvas-data.ts'
import {
  formatDiameter,
  formatFlow,
  formatLength,
  formatLoad,
  formatPressure,
  formatVelocity,
  NO_VALUE,
} from '@shared/units/format.ts'
import { formatNominal } from '@shared/units/nominal.ts'
import { problemSummary } from '@/features/editor/nodes/node-display.ts'

/** Separator between the label's parts. */
export const LABEL_SEPARATOR = ' · '

/** Whether the pipe's size is fixed by the designer rather than chosen by the calculation. */
export function isSizeLocked(data: PipeEdgeData): boolean {
  return data.result?.locked ?? data.pipe.nominal !== undefined
}

/**
 * `<load> · <flow> · <size> · <velocity>` in display units, e.g. "58 FU · 3.90 L/s · DN50 · 1.92 m/s".
 * Before a result exists only a locked size (or a dash) shows; a pipe no size fits reads "no size".
 */
export function pipeLabelText({ pipe, result, units }: PipeEdgeData): string {
  if (!result) return pipe.nominal ? formatNominal(pipe.nominal, units) : NO_VALUE
  const parts = [
    formatLoad(result.load),
    formatFlow(result.flowLps, units),
    result.nominal === null ? 'no size' : formatNominal(result.nominal, units),
  ]
  if (result.velocityMps !== null) parts.push(formatVelocity(result.velocityMps, units))
  return parts.join(LABEL_SEPARATOR)
}

/** A multi-line tooltip with every figure the label leaves out, then the problems. */
export function pipeLabelTitle(data: PipeEdgeData): string {
  const { pipe, result, units } = data
  const system = pipe.system === 'hot' ? 'Hot' : 'Cold'
  const lines = [`${system} pipe ${pipe.id} · ${formatLength(pipe.lengthM, units)}`]
  if (result) {
    lines.push(`Load ${formatLoad(result.load)}`)
    const split =
      result.equipmentFlowLps > 0
        ? ` (fixtures ${formatFlow(result.fixtureFlowLps, units)} + equipment ${formatFlow(result.equipmentFlowLps, units)})`
        : ''
    lines.push(`Flow ${formatFlow(result.flowLps, units)}${split}`)
    const size = result.nominal === null ? 'no size fits' : formatNominal(result.nominal, units)
    const inside =
      result.insideDiameterMm === null
        ? ''
        : `, inside ${formatDiameter(result.insideDiameterMm, units)}`
    lines.push(`Size ${size}${result.locked ? ' (locked)' : ''} ${result.material}${inside}`)
    lines.push(`Velocity ${formatVelocity(result.velocityMps, units)}`)
    lines.push(
      `Loss ${formatPressure(result.lossKPa, units)} over ${formatLength(result.equivalentLengthM, units)} equivalent`,
    )
    lines.push(
      `Pressure ${formatPressure(result.inletPressureKPa, units)} → ${formatPressure(result.outletPressureKPa, units)}`,
    )
  }
  const problems = problemSummary(data.problems, units)
  return problems === '' ? lines.join('\n') : `${lines.join('\n')}\n${problems}`
}
