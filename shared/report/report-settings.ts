/** The settings and load basis section of the report, in the project's units. */
import { MATERIALS } from '../calc/materials.ts'
import type { Settings } from '../document/model.ts'
import { formatQuantity } from '../units/format.ts'
import type { UnitSystem } from '../units/system.ts'

export interface LabelledValue {
  label: string
  value: string
}

const BASIS: Record<Settings['loadBasis'], { name: string; text: string }> = {
  'per-fixture': {
    name: 'Per fixture (IPC fixture loads)',
    text:
      'Each fixture adds its count times its water supply fixture units from IPC Table E103.3(2), ' +
      "public or private column by occupancy. Loads become design flows by Hunter's curve " +
      '(IPC Table E103.3(3)): the flush valve column where a pipe serves a flush valve fixture, ' +
      'the flush tank column otherwise. Continuous equipment flows are added.',
  },
  'flush-valve-series': {
    name: 'Flush valve series',
    text:
      'Flush valve water closets and urinals add a diminishing series per kind; other fixtures ' +
      "add their UPC Table A 103.1 totals. Loads become design flows by Hunter's curve " +
      '(IPC Table E103.3(3)): the flush valve column where a pipe serves a flush valve fixture, ' +
      'the flush tank column otherwise. Continuous equipment flows are added.',
  },
}

/** Name and explanation of the load basis. */
export const loadBasisText = (basis: Settings['loadBasis']) => BASIS[basis]

/** The settings as label/value pairs. */
export function settingsRows(settings: Settings, units: UnitSystem): LabelledValue[] {
  const q = formatQuantity
  return [
    { label: 'Load basis', value: BASIS[settings.loadBasis].name },
    { label: 'Occupancy', value: settings.occupancy },
    {
      label: 'Velocity limits',
      value: `cold ${q('velocity', settings.velocityLimits.cold, units)}, hot ${q('velocity', settings.velocityLimits.hot, units)}`,
    },
    {
      label: 'Fitting allowance',
      value: `${Math.round(settings.fittingAllowance * 100)} % of developed length`,
    },
    { label: 'Minimum residual pressure', value: q('pressure', settings.minPressureKPa, units) },
    { label: 'Maximum static pressure', value: q('pressure', settings.maxStaticKPa, units) },
    { label: 'Default material', value: MATERIALS[settings.material]?.label ?? settings.material },
    {
      label: 'Friction method',
      value:
        settings.frictionMethod === 'hazen-williams'
          ? 'Hazen-Williams'
          : 'Darcy-Weisbach (Swamee-Jain)',
    },
    { label: 'Cold water temperature', value: `${settings.waterTempC} °C` },
  ]
}
