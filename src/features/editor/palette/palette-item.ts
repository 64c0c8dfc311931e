/**
 * What the palette hands to the canvas: a node kind to place (with its fixture for fixture
 * presets), by drag and drop or by click, and battery requests. The drop side reads the drag
 * payload back with {@link readPaletteDrop}, which rejects anything malformed with a message.
 */
import { z } from 'zod'
import { NODE_KINDS, type NodeKind } from '@shared/document/model.ts'

/** `DataTransfer` type under which a dragged palette item travels (JSON of {@link PaletteItem}). */
export const PALETTE_DRAG_TYPE = 'application/x-tributary-node'

/** Largest battery the palette offers. */
export const BATTERY_MAX_COUNT = 200

/** A node to add: its kind, and for fixtures the catalogue key. */
export const paletteItemSchema = z
  .object({ kind: z.enum(NODE_KINDS), fixture: z.string().min(1).optional() })
  .refine((item) => item.kind !== 'fixture' || item.fixture !== undefined, {
    message: 'fixture is required when kind is "fixture"',
    path: ['fixture'],
  })
export type PaletteItem = z.infer<typeof paletteItemSchema>

/** A battery of `count` identical fixtures on one connection. */
export const batteryRequestSchema = z.object({
  fixture: z.string().min(1, 'fixture is required'),
  count: z
    .number({ error: 'count must be a number' })
    .int('count must be a whole number')
    .min(1, 'count must be at least 1')
    .max(BATTERY_MAX_COUNT, `count must be at most ${BATTERY_MAX_COUNT}`),
})
export type BatteryRequest = z.infer<typeof batteryRequestSchema>

/** Node kinds the palette offers directly; fixtures come as presets. */
export const PALETTE_KINDS: readonly Exclude<NodeKind, 'fixture'>[] = [
  'supply',
  'meter',
  'backflow-preventer',
  'pressure-reducing-valve',
  'water-heater',
  'junction',
  'equipment',
]

/** Fixture presets in the palette, by catalogue key. */
export const FIXTURE_PRESETS: readonly string[] = [
  'lavatory',
  'water-closet-flush-valve',
  'urinal-flush-valve',
  'kitchen-sink',
  'service-sink',
  'hose-bibb',
  'shower',
  'drinking-fountain',
  'dishwasher',
]

/** Test id of a palette item: its fixture key for presets, else its kind. */
export function paletteItemKey(item: PaletteItem): string {
  return item.fixture ?? item.kind
}

/**
 * Reads a palette item from a drop. Returns null when the drag did not come from the palette
 * (so the canvas can ignore it), and an error naming the field when the payload is malformed.
 */
export function readPaletteDrop(
  transfer: Pick<DataTransfer, 'getData'> | null,
): { ok: true; value: PaletteItem } | { ok: false; error: string } | null {
  const raw = transfer?.getData(PALETTE_DRAG_TYPE) ?? ''
  if (raw === '') return null
  let json: unknown
  try {
    json = JSON.parse(raw)
  } catch {
    return { ok: false, error: 'Dropped item is not valid JSON' }
  }
  const parsed = paletteItemSchema.safeParse(json)
  if (parsed.success) return { ok: true, value: parsed.data }
  const issue = parsed.error.issues[0]!
  const field = issue.path.length > 0 ? issue.path.join('.') : 'item'
  return { ok: false, error: `Dropped item: ${field}: ${issue.message}` }
}
