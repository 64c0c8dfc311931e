/**
 * An engine issue's message in the display unit system. The engine writes its quantities in SI
 * as "<number> <unit>" (kPa, m/s, L/s, m: shared/calc/result.ts, validate.ts), which is also what
 * the CLI and the JSON export carry; on screen and in the report a US-unit project reads each one
 * formatted as everywhere else (psi, ft/s, gpm, ft).
 */
import type { CalcIssue } from '../calc/types.ts'
import { formatFlow, formatLength, formatPressure, formatVelocity } from './format.ts'
import type { UnitSystem } from './system.ts'

const SI_QUANTITY = /(-?\d+(?:\.\d+)?) (kPa|m\/s|L\/s|m)(?![\w/])/g

const FORMAT: Record<string, (si: number, units: UnitSystem) => string> = {
  kPa: formatPressure,
  'm/s': formatVelocity,
  'L/s': formatFlow,
  m: formatLength,
}

/**
 * @example
 * issueText({ message: 'F1 gets 95.2 kPa; it needs 100.0 kPa.', … }, 'us') // 'F1 gets 13.8 psi; it needs 14.5 psi.'
 */
export function issueText(issue: Pick<CalcIssue, 'message'>, units: UnitSystem): string {
  if (units === 'si') return issue.message
  return issue.message.replace(SI_QUANTITY, (_, value: string, unit: string) =>
    FORMAT[unit]!(Number(value), units),
  )
}
