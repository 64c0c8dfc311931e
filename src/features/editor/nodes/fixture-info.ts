/** What the canvas needs from the fixture catalogue: a label and whether there is a hot inlet. */
import { FIXTURES } from '@shared/calc/fixtures.ts'

/** Display label of a fixture key: the catalogue's label, else the key itself. */
export function fixtureLabel(key: string): string {
  return FIXTURES[key]?.label ?? key
}

/**
 * Whether a fixture has a hot inlet. An unknown key gets one, so a hot pipe into it keeps its end
 * on the canvas while the calculation reports the unknown fixture.
 */
export function fixtureUsesHot(key: string): boolean {
  return FIXTURES[key]?.supplies.hot ?? true
}

/** Every catalogue key, for pickers. */
export function fixtureKeys(): string[] {
  return Object.keys(FIXTURES)
}
