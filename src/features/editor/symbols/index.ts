/** The symbol component of each node kind, for nodes, the palette and the legend. */
import type { Component } from 'vue'
import type { NodeKind } from '@shared/document/model.ts'
import BackflowPreventerSymbol from './BackflowPreventerSymbol.vue'
import EquipmentSymbol from './EquipmentSymbol.vue'
import FixtureSymbol from './FixtureSymbol.vue'
import JunctionSymbol from './JunctionSymbol.vue'
import MeterSymbol from './MeterSymbol.vue'
import PressureReducingValveSymbol from './PressureReducingValveSymbol.vue'
import SupplySymbol from './SupplySymbol.vue'
import WaterHeaterSymbol from './WaterHeaterSymbol.vue'

/** Symbol component per node kind; each takes an optional `size` prop (px). */
export const KIND_SYMBOLS: Record<NodeKind, Component> = {
  supply: SupplySymbol,
  meter: MeterSymbol,
  'backflow-preventer': BackflowPreventerSymbol,
  'pressure-reducing-valve': PressureReducingValveSymbol,
  'water-heater': WaterHeaterSymbol,
  junction: JunctionSymbol,
  fixture: FixtureSymbol,
  equipment: EquipmentSymbol,
}
