/**
 * The size and pressure sections: material and bore, why this nominal size, velocity against the
 * limit, friction per length and over the equivalent length, pressure at both ends.
 */
import type { PipeExplanation } from '@shared/calc/explain'
import { minDiameterMm } from '@shared/calc/friction'
import { MATERIALS } from '@shared/calc/materials'
import type { PipeResult, SizeBasis } from '@shared/calc/types'
import type { Settings } from '@shared/document/model'
import { KPA_PER_PSI, METRES_PER_FOOT } from '@shared/units/factors'
import {
  formatDiameter,
  formatElevation,
  formatFlow,
  formatLength,
  formatPressure,
  formatVelocity,
  roundForDisplay,
} from '@shared/units/format'
import { formatNominal } from '@shared/units/nominal'
import type { UnitSystem } from '@shared/units/system'
import { line, type InspectorLine } from './inspector-types'
import { describeSource } from '@shared/calc/sources'

/** Smallest size of the pipe's material whose bore keeps the flow within the velocity limit. */
function velocitySize(p: PipeResult, limitMps: number) {
  const need = minDiameterMm(p.flowLps, limitMps)
  return MATERIALS[p.material]?.sizes.find((s) => s.insideDiameterMm >= need)
}

/**
 * The basis the calculation reports; for a result without one (built before the engine gave it),
 * the closest reading of the numbers: a larger size than velocity needs counts as upsized.
 */
export function sizeBasisOf(p: PipeResult, settings: Settings): SizeBasis {
  if (p.sizeBasis) return p.sizeBasis
  if (p.nominal === null) return 'none'
  if (p.locked) return 'locked'
  const first = velocitySize(p, settings.velocityLimits[p.system])
  return !first || first.nominal === p.nominal ? 'velocity' : 'pressure-budget'
}

/** Why the pipe has its size, in one sentence, from the basis the calculation reports. */
export function sizingReason(p: PipeResult, settings: Settings, units: UnitSystem): InspectorLine {
  const material = MATERIALS[p.material]
  const label = material?.label ?? p.material
  const limitMps = settings.velocityLimits[p.system]
  const limit = formatVelocity(limitMps, units)
  const size = formatNominal(p.nominal, units)
  switch (sizeBasisOf(p, settings)) {
    case 'none': {
      const largest = material
        ? formatNominal(material.sizes.at(-1)!.nominal, units)
        : 'the largest'
      return line(
        `No size: even ${largest} ${label} carries ${formatFlow(p.flowLps, units)} faster than ${limit}.`,
        'problem',
      )
    }
    case 'locked':
      return line(`${size} is locked by the designer; the calculation does not resize it.`)
    case 'fixture-minimum': {
      const m = p.fixtureMinimum
      const what = m
        ? ` for ${m.label} ${m.nodeId} (${describeSource(m.source)})`
        : ' of the fixture it feeds'
      return line(
        `${size} is the minimum supply size${what}; a smaller size would already keep the velocity within ${limit}.`,
      )
    }
    case 'pressure-budget': {
      // Name the size velocity alone would have given, so the reviewer sees the step.
      const first = velocitySize(p, limitMps)
      const from = first
        ? ` from ${formatNominal(first.nominal, units)} (the smallest within ${limit})`
        : ''
      return line(
        `${size} is upsized${from} to cut friction, so that the fixtures beyond get their minimum pressure.`,
      )
    }
    case 'velocity': {
      if (!(p.flowLps > 0)) return line(`${size}: no flow, so the smallest size of the material.`)
      const need = formatDiameter(minDiameterMm(p.flowLps, limitMps), units)
      return line(
        `${size} is the smallest size that keeps the velocity within ${limit}: the flow needs an ` +
          `inside diameter of at least ${need}.`,
      )
    }
  }
}

/** Friction loss per length: kPa/m in SI, psi per 100 ft in US (the usual design figures). */
export function frictionRate(lossKPa: number, lengthM: number, units: UnitSystem): string {
  const perMetre = lengthM > 0 ? lossKPa / lengthM : 0
  if (units === 'si') return `${roundForDisplay(perMetre, 3, 3)} kPa/m`
  return `${roundForDisplay(((perMetre * METRES_PER_FOOT) / KPA_PER_PSI) * 100, 3, 2)} psi/100 ft`
}

/** Sentences of the size section. */
export function sizeLines(p: PipeResult, settings: Settings, units: UnitSystem): InspectorLine[] {
  const material = MATERIALS[p.material]
  const friction =
    settings.frictionMethod === 'darcy-weisbach'
      ? `roughness ${material?.roughnessMm} mm`
      : `Hazen-Williams C ${material?.hazenWilliamsC}`
  const lines: InspectorLine[] = [
    line(
      material
        ? `Material: ${material.label} (${material.standard}), ${friction}.`
        : `Material: ${p.material}.`,
    ),
    sizingReason(p, settings, units),
  ]
  if (p.nominal === null || p.insideDiameterMm === null || p.velocityMps === null) return lines
  const limit = settings.velocityLimits[p.system]
  const share = Math.round((p.velocityMps / limit) * 100)
  lines.push(line(`Inside diameter: ${formatDiameter(p.insideDiameterMm, units)}.`))
  lines.push(
    line(
      `Velocity: ${formatVelocity(p.velocityMps, units)} against a ${p.system} water limit of ` +
        `${formatVelocity(limit, units)} (${share} %).`,
      p.velocityMps > limit ? 'problem' : 'total',
    ),
  )
  return lines
}

const METHOD = { 'hazen-williams': 'Hazen-Williams', 'darcy-weisbach': 'Darcy-Weisbach' } as const

/** Sentences of the pressure section. */
export function pressureLines(
  x: PipeExplanation,
  lengthM: number,
  settings: Settings,
  units: UnitSystem,
): InspectorLine[] {
  const p = x.pipe
  const allowance = Math.round(settings.fittingAllowance * 100)
  const lines: InspectorLine[] = [
    line(
      `Equivalent length: ${formatLength(lengthM, units)} developed + ${allowance} % for fittings = ` +
        `${formatLength(p.equivalentLengthM, units)}.`,
    ),
  ]
  if (p.lossKPa !== null) {
    lines.push(
      line(
        `Friction (${METHOD[settings.frictionMethod]}): ${frictionRate(p.lossKPa, p.equivalentLengthM, units)} ` +
          `over ${formatLength(p.equivalentLengthM, units)} = ${formatPressure(p.lossKPa, units)}.`,
      ),
    )
  }
  const rise = x.elevationChangeM
  if (rise !== 0) {
    const verb = rise > 0 ? 'rises' : 'falls'
    lines.push(
      line(
        `The pipe ${verb} ${formatElevation(Math.abs(rise), units)}: ` +
          `${rise > 0 ? 'loses' : 'gains'} ${formatPressure(Math.abs(x.staticChangeKPa), units)} of static head.`,
      ),
    )
  }
  if (p.inletPressureKPa === null || p.outletPressureKPa === null) {
    lines.push(line('No flowing pressure: no supply reaches this pipe.', 'problem'))
  } else {
    lines.push(
      line(
        `Pressure: ${formatPressure(p.inletPressureKPa, units)} at the inlet, ` +
          `${formatPressure(p.outletPressureKPa, units)} at the outlet.`,
        'total',
      ),
    )
  }
  return lines
}
