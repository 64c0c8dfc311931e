/**
 * Floor levels drawn as horizontal bands on the canvas, highest level at the top, so the drawing
 * reads as a riser diagram. Pure geometry shared by the canvas, the auto-layout and the seed.
 */
import type { Level } from './model.ts'

/** Height of one level's band in canvas pixels. */
export const LEVEL_BAND_HEIGHT = 360

export interface LevelBand {
  level: Level
  top: number
  bottom: number
}

/**
 * Bands of `levels`, top to bottom (highest elevation first).
 * @example levelBands([{ id: 'g', name: 'Ground', elevationM: 0 }])[0].top // 0
 */
export function levelBands(levels: readonly Level[]): LevelBand[] {
  return [...levels]
    .sort((a, b) => b.elevationM - a.elevationM || a.name.localeCompare(b.name))
    .map((level, i) => ({
      level,
      top: i * LEVEL_BAND_HEIGHT,
      bottom: (i + 1) * LEVEL_BAND_HEIGHT,
    }))
}

/** The level whose band holds canvas height `y`; above the top band the top level, below the bottom one the lowest. */
export function levelAtY(levels: readonly Level[], y: number): Level | null {
  const bands = levelBands(levels)
  if (!bands.length) return null
  const hit = bands.find((b) => y >= b.top && y < b.bottom)
  return (hit ?? (y < 0 ? bands[0] : bands[bands.length - 1]))!.level
}

/**
 * Elevation after moving a node from `from` to `to`: it keeps its height above the floor (a
 * fixture connection 1 m above the floor stays 1 m above the new floor).
 */
export function elevationOnLevel(
  elevationM: number,
  from: Level | null | undefined,
  to: Level,
): number {
  const aboveFloor = from ? elevationM - from.elevationM : 0
  return Math.round((to.elevationM + aboveFloor) * 1000) / 1000
}
