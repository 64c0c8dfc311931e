/**
 * Messages for the properties panel and settings drawer. Turns zod issues from the document
 * schemas into sentences that name the field, with bounds in the user's display units
 * ("Cold velocity limit must be at most 32.8 ft/s", not "<=10"), and validates a patch the way
 * the operation will, so a bad value is refused beside its field before it reaches the store.
 */
import type { z } from 'zod'
import { levelSchema, nodeSchema, pipeSchema, settingsSchema } from '@shared/document/model'
import type { DiagramNode, Level, Pipe, Settings } from '@shared/document/model'
import {
  levelPatchSchema,
  nodePatchSchema,
  pipePatchSchema,
  settingsPatchSchema,
  type LevelPatch,
  type NodePatch,
  type PipePatch,
  type SettingsPatch,
} from '@shared/document/operations'
import { formatQuantity } from '@shared/units/format'
import type { ParseResult } from '@shared/units/parse'
import type { Quantity } from '@shared/units/quantities'
import type { UnitSystem } from '@shared/units/system'

type Issue = z.core.$ZodIssue

/** Stored fields measured in a display quantity, by their last path key. */
const FIELD_QUANTITIES: Record<string, Quantity> = {
  elevationM: 'elevation',
  pressureKPa: 'pressure',
  lossKPa: 'pressure',
  setKPa: 'pressure',
  minPressureKPa: 'pressure',
  maxStaticKPa: 'pressure',
  flowLps: 'flow',
  lengthM: 'length',
}

/** A schema bound as the user would read it: in their units, or as the drawer shows it. */
function boundText(path: readonly PropertyKey[], bound: number, units: UnitSystem): string {
  const key = path.map(String).join('.')
  if (key.startsWith('velocityLimits.')) return formatQuantity('velocity', bound, units)
  if (key === 'fittingAllowance') return `${Math.round(bound * 100)} %`
  if (key === 'waterTempC') return `${bound} °C`
  const quantity = FIELD_QUANTITIES[String(path.at(-1))]
  return quantity ? formatQuantity(quantity, bound, units) : String(bound)
}

/** What is wrong, as the end of a sentence that starts with the field's label. */
export function issueText(issue: Issue, units: UnitSystem): string {
  switch (issue.code) {
    case 'too_small': {
      if (issue.origin === 'string') return 'cannot be empty'
      const bound = boundText(issue.path, Number(issue.minimum), units)
      return issue.inclusive ? `must be at least ${bound}` : `must be more than ${bound}`
    }
    case 'too_big': {
      if (issue.origin === 'string') return `must be at most ${issue.maximum} characters`
      const bound = boundText(issue.path, Number(issue.maximum), units)
      return issue.inclusive ? `must be at most ${bound}` : `must be less than ${bound}`
    }
    case 'invalid_type':
      return issue.expected === 'int' ? 'must be a whole number' : `must be a ${issue.expected}`
    case 'invalid_value':
      return `must be one of ${issue.values.map(String).join(', ')}`
    default:
      return issue.message
  }
}

/** The first issue of a failed parse as "<label> <what is wrong>", or null when it passed. */
export function parseError(
  parsed: z.ZodSafeParseResult<unknown>,
  label: string,
  units: UnitSystem,
): string | null {
  if (parsed.success) return null
  return `${label} ${issueText(parsed.error.issues[0]!, units)}`
}

/** An item with a patch applied as the operation applies it: `null` removes the field. */
export function withPatch(item: object, patch: object): Record<string, unknown> {
  const next: Record<string, unknown> = { ...item }
  for (const [key, value] of Object.entries(patch)) {
    if (value === null) delete next[key]
    else if (value !== undefined) next[key] = value
  }
  return next
}

/** Why `patch` cannot apply to `node`, or null. Checks the op's patch and the resulting node. */
export function nodePatchError(
  node: DiagramNode,
  patch: NodePatch,
  label: string,
  units: UnitSystem,
): string | null {
  return (
    parseError(nodePatchSchema.safeParse(patch), label, units) ??
    parseError(nodeSchema.safeParse(withPatch(node, patch)), label, units)
  )
}

/** Why `patch` cannot apply to `pipe`, or null. */
export function pipePatchError(
  pipe: Pipe,
  patch: PipePatch,
  label: string,
  units: UnitSystem,
): string | null {
  return (
    parseError(pipePatchSchema.safeParse(patch), label, units) ??
    parseError(pipeSchema.safeParse(withPatch(pipe, patch)), label, units)
  )
}

/** Why `patch` cannot apply to the settings, or null. */
export function settingsPatchError(
  settings: Settings,
  patch: SettingsPatch,
  label: string,
  units: UnitSystem,
): string | null {
  return (
    parseError(settingsPatchSchema.safeParse(patch), label, units) ??
    parseError(settingsSchema.safeParse({ ...settings, ...patch }), label, units)
  )
}

/** Why `patch` cannot apply to `level`, or null. */
export function levelPatchError(
  level: Level,
  patch: LevelPatch,
  label: string,
  units: UnitSystem,
): string | null {
  return (
    parseError(levelPatchSchema.safeParse(patch), label, units) ??
    parseError(levelSchema.safeParse(withPatch(level, patch)), label, units)
  )
}

/**
 * Reads a plain number (a count, fixture units, a percentage). Empty text is `null` when the
 * field is optional; range checks are left to the schema so the message names its bound.
 */
export function parsePlainNumber(
  text: string,
  label: string,
  optional = false,
): ParseResult<number | null> {
  const trimmed = text.trim()
  if (trimmed === '')
    return optional ? { ok: true, value: null } : { ok: false, error: `${label} is required` }
  const value = Number(trimmed)
  if (!Number.isFinite(value))
    return { ok: false, error: `${label} must be a number, got "${trimmed}"` }
  return { ok: true, value }
}
