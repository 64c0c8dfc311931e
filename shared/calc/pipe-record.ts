/**
 * Layout of the per-pipe numbers the sizing sweep reads and writes. They are interleaved —
 * pipe q's fields sit side by side at q × stride — so the sweep walks a few short records front
 * to back instead of some thirty arrays: fewer streams and fewer bytes per pipe for the
 * processor to fetch. Numbers the sweep does not need (static pressure, the fixture share of a
 * flow with equipment) live in plain arrays on the engine.
 */

/** Engine.fin: float inputs, constant between edits of the pipe or its nodes. */
export const FIN = 3
/** Equivalent length (length plus fitting allowance), m. */
export const LEQ = 0
/** Static head change over the pipe, kPa (9.81 kPa per metre of rise). */
export const RISE = 1
/** Required pressure of the node the pipe feeds (-Infinity: none). */
export const REQ = 2

/** Engine.fo: float results (the load is read from the sums: hydraulics.ts loadAt). */
export const FOUT = 3
/** Design flow (fixtures plus equipment), L/s. */
export const FLOW = 0
/** Friction loss, kPa. */
export const FRICTION = 1
/** Residual pressure at the outlet, kPa; NaN when unknown (not reached, or a pipe unsized). */
export const OUT_P = 2

/** Engine.io: integer fields. */
export const IOUT = 4
/** Sizing class (demand-memo.ts). */
export const CLASS = 0
/** Sizes added by the pressure budget. */
export const UP = 1
/** Size index in the material, -1 when none. */
export const SIZE = 2
/** Bit flags, below. */
export const FLAGS = 3

/** Flag: the budget gave up on the fixture this pipe feeds. */
export const GIVEN_UP = 1
/** Flag: the pipe serves a flush valve (flush valve demand curve). */
export const VALVE_CURVE = 2
/** Flag: the node the pipe leaves caps the pressure or loses some (engine.cap / devLoss). */
export const AFTER_DEVICE = 4
