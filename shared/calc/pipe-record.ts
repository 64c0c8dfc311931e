/**
 * Layout of the per-pipe numbers the sizing sweep reads and writes. They are interleaved — pipe
 * q's fields sit side by side at q × stride — in two records, one of floats and one of integers,
 * so that each step of the sweep reads and writes two arrays besides the loads and the memo.
 * V8 checks every typed array it touches once per loop step (map, length, bounds), so fewer
 * arrays make a shorter step: with inputs and results in separate records and the parent link in
 * the graph, the sweep took about a tenth longer (bench/calc.bench.ts, 1,000 and 10,000 nodes).
 * Numbers the sweep does not need (static pressure, the fixture share of a flow with equipment)
 * live in plain arrays on the engine.
 */

/** Engine.rec: floats. Inputs (constant between edits of the pipe or its nodes), then results. */
export const REC = 6
/** Equivalent length (length plus fitting allowance), m. */
export const LEQ = 0
/** Static head change over the pipe, kPa (9.81 kPa per metre of rise). */
export const RISE = 1
/** Required pressure of the node the pipe feeds (-Infinity: none). */
export const REQ = 2
/** Design flow (fixtures plus equipment), L/s (the load is read from the sums: loadAt). */
export const FLOW = 3
/** Friction loss, kPa. */
export const FRICTION = 4
/** Residual pressure at the outlet, kPa; NaN when unknown (not reached, or a pipe unsized). */
export const OUT_P = 5

/** Engine.irec: integers. */
export const IREC = 5
/** Sizing class (demand-memo.ts). */
export const CLASS = 0
/** Sizes added by the pressure budget. */
export const UP = 1
/** Size index in the material, -1 when none. */
export const SIZE = 2
/** Bit flags, below. */
export const FLAGS = 3
/** The parent pipe (a copy of the graph's, for the sweep), -1 for a pipe leaving the supply. */
export const PARENT = 4

/** Flag: the budget gave up on the fixture this pipe feeds. */
export const GIVEN_UP = 1
/** Flag: the pipe serves a flush valve (flush valve demand curve). */
export const VALVE_CURVE = 2
/** Flag: the node the pipe leaves caps the pressure or loses some (engine.cap / devLoss). */
export const AFTER_DEVICE = 4
