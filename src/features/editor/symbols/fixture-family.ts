/** Which fixture mark to draw for a catalogue key. */
export type FixtureFamily = 'basin' | 'flush' | 'shower' | 'hose'

/** Picks the mark by the key's wording; anything unrecognised is a basin. */
export function fixtureFamily(key: string | undefined): FixtureFamily {
  if (!key) return 'basin'
  if (key.includes('flush-valve')) return 'flush'
  if (key.includes('shower')) return 'shower'
  if (key.includes('hose')) return 'hose'
  return 'basin'
}
