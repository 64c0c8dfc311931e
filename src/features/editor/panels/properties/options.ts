/**
 * Choices for the panel's selects, built from the catalogues and the document. Sentinel values
 * stand for "field absent"; they cannot collide with catalogue keys, nominals or level ids
 * because those never start with a colon.
 */
import { FIXTURES } from '@shared/calc/fixtures'
import { MATERIALS } from '@shared/calc/materials'
import type { Level, Occupancy } from '@shared/document/model'
import { formatElevation } from '@shared/units/format'
import { formatNominal } from '@shared/units/nominal'
import type { UnitSystem } from '@shared/units/system'
import type { SelectGroupOption, SelectOption } from 'naive-ui'

/** The pipe takes the diagram's default material. */
export const MATERIAL_DEFAULT = ':default'
/** The calculation picks the size. */
export const SIZE_AUTOMATIC = ':auto'
/** The node is on no floor level. */
export const NO_LEVEL = ':none'
/** The fixture takes the diagram's occupancy. */
export const OCCUPANCY_INHERIT = ':inherit'

/** Catalogue fixtures grouped by the supplies they take, the way a designer scans for them. */
export function fixtureOptions(): SelectGroupOption[] {
  const groups = [
    { key: 'both', label: 'Cold and hot', test: (c: boolean, h: boolean) => c && h },
    { key: 'cold', label: 'Cold only', test: (c: boolean, h: boolean) => c && !h },
    { key: 'hot', label: 'Hot only', test: (c: boolean, h: boolean) => !c && h },
  ]
  const fixtures = Object.values(FIXTURES)
  return groups
    .map(({ key, label, test }) => ({
      type: 'group' as const,
      key,
      label,
      children: fixtures
        .filter((f) => test(f.supplies.cold, f.supplies.hot))
        .map((f) => ({ label: f.label, value: f.key })),
    }))
    .filter((group) => group.children.length > 0)
}

export function occupancyOptions(inherited: Occupancy): SelectOption[] {
  return [
    { label: `As the diagram (${inherited})`, value: OCCUPANCY_INHERIT },
    { label: 'Public', value: 'public' },
    { label: 'Private', value: 'private' },
  ]
}

/** Display name of a material key; an unknown key shows as itself so it can still be fixed. */
export function materialLabel(key: string): string {
  return MATERIALS[key]?.label ?? key
}

export function materialOptions(defaultKey: string): SelectOption[] {
  return [
    { label: `Default (${materialLabel(defaultKey)})`, value: MATERIAL_DEFAULT },
    ...Object.values(MATERIALS).map((m) => ({ label: m.label, value: m.key })),
  ]
}

/** A nominal size as DN in SI and inches in US; the material's DN covers sizes the table lacks. */
export function sizeLabel(nominal: string, units: UnitSystem, materialKey?: string): string {
  const dn = MATERIALS[materialKey ?? '']?.sizes.find((s) => s.nominal === nominal)?.dn
  if (units === 'si' && dn) return `DN${dn}`
  return formatNominal(nominal, units)
}

/**
 * "Size automatically" and the material's sizes. A locked size the material does not make stays
 * listed, marked, so the user sees why the calculation complains and can pick another.
 */
export function sizeOptions(
  materialKey: string,
  units: UnitSystem,
  locked: string | undefined,
): SelectOption[] {
  const sizes = MATERIALS[materialKey]?.sizes ?? []
  const options: SelectOption[] = [
    { label: 'Size automatically', value: SIZE_AUTOMATIC },
    ...sizes.map((s) => ({ label: sizeLabel(s.nominal, units, materialKey), value: s.nominal })),
  ]
  if (locked !== undefined && !sizes.some((s) => s.nominal === locked)) {
    const label = `${sizeLabel(locked, units)} (not made in ${materialLabel(materialKey)})`
    options.push({ label, value: locked })
  }
  return options
}

/** Levels highest first, as the canvas draws them, with "no level". */
export function levelOptions(levels: readonly Level[], units: UnitSystem): SelectOption[] {
  return [
    { label: 'No level', value: NO_LEVEL },
    ...[...levels]
      .sort((a, b) => b.elevationM - a.elevationM)
      .map((l) => ({ label: `${l.name} (${formatElevation(l.elevationM, units)})`, value: l.id })),
  ]
}
