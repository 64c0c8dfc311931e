/**
 * Colours and line patterns of the canvas. Cold and hot differ in colour AND pattern (cold solid,
 * hot dashed) so a greyscale print still tells them apart; problems add a halo and an icon, never
 * colour alone.
 */
import type { System } from '@shared/document/model.ts'
import { palette } from '@/theme'

/** Canvas colours: water systems from the app palette, plus ink, muted text and problems. */
export const CANVAS_COLORS = {
  cold: palette.cold,
  hot: palette.hot,
  ink: palette.ink,
  muted: '#5d6a74',
  line: palette.line,
  card: '#ffffff',
  selected: palette.river,
  // Crimson, kept clear of the clay used for hot water.
  problem: '#c0143c',
} as const

/** SVG `stroke-dasharray` of each system's pipes; `undefined` draws a solid line. */
export const SYSTEM_DASH: Record<System, string | undefined> = {
  cold: undefined,
  hot: '7 4',
}

/** Stroke width of a pipe, px. */
export const PIPE_STROKE_WIDTH = 2
