/**
 * Canvas placement of the Fernhollow Community Hall demo, drawn as a riser diagram: the upper
 * level's band on top (y 0–360), the ground level below (y 360–720); on each level the fixtures
 * stand in a row above the mains, cold mains run left to right, hot mains run below them, and the
 * risers go straight up. Fixtures are spaced ~190 px so every pipe label has room.
 */
export const FERNHOLLOW_POSITIONS: Record<string, { x: number; y: number }> = {
  // ground: service entrance and mechanical room
  supply: { x: 0, y: 540 },
  meter: { x: 190, y: 540 },
  backflow: { x: 380, y: 540 },
  'j-mech': { x: 600, y: 560 },
  'hb-north': { x: 520, y: 430 },
  heater: { x: 640, y: 620 },
  'jh-mech': { x: 800, y: 680 },
  // ground: washroom core
  'j-core': { x: 900, y: 560 },
  'df-lobby': { x: 860, y: 430 },
  'j-g-men': { x: 1150, y: 560 },
  'wc-g-men': { x: 1050, y: 430 },
  'ur-g-men': { x: 1240, y: 430 },
  'lav-g-men': { x: 1430, y: 430 },
  'j-g-women': { x: 1700, y: 560 },
  'wc-g-women': { x: 1620, y: 430 },
  'lav-g-women': { x: 1810, y: 430 },
  'jh-core': { x: 1300, y: 680 },
  'jh-g-women': { x: 1760, y: 680 },
  // risers
  'riser-c-base': { x: 2080, y: 560 },
  'riser-h-base': { x: 2120, y: 680 },
  'riser-c-top': { x: 2080, y: 250 },
  'riser-h-top': { x: 2120, y: 300 },
  // upper washrooms
  'j-u-men': { x: 1880, y: 250 },
  'wc-u-men': { x: 1780, y: 110 },
  'lav-u-men': { x: 1970, y: 110 },
  'j-u-women': { x: 2300, y: 250 },
  'wc-u-women': { x: 2200, y: 110 },
  'lav-u-women': { x: 2390, y: 110 },
  // ground: kitchenette, janitor's closet, south wall
  'j-service': { x: 2400, y: 600 },
  'jh-service': { x: 2440, y: 700 },
  'ks-kitchen': { x: 2330, y: 430 },
  'dw-kitchen': { x: 2520, y: 430 },
  'ss-janitor': { x: 2710, y: 430 },
  'hb-south': { x: 2900, y: 430 },
}
