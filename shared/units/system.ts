/** The display unit system. Documents are always SI; this only changes what the user sees and types. */
import { z } from 'zod'

/** Unit systems the client can display: `si` (L/s, kPa, m, mm, DN) or `us` (gpm, psi, ft, in, CTS). */
export const unitSystemSchema = z.enum(['si', 'us'])

/** A display unit system, `'si' | 'us'`. */
export type UnitSystem = z.infer<typeof unitSystemSchema>

/** Both unit systems, in the order a picker lists them. */
export const UNIT_SYSTEMS = unitSystemSchema.options
