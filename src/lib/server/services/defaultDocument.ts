// the first revision of a new assembly: a small, sensible build-up for its element and
// the default exposure with the inside surface resistance for the heat-flow direction.
import { defaultExposure, ISO6946_RSI, type DocLayer, type WorkbenchDocument } from '../../schemas/workbench';

export type Element = 'wall' | 'roof' | 'floor';

const layer = (id: string, l: Omit<DocLayer, 'id' | 'materialRef' | 'vapourResistanceFactor' | 'note'> & { vapourResistanceFactor?: number }): DocLayer => ({
  id,
  materialRef: null,
  note: '',
  vapourResistanceFactor: l.vapourResistanceFactor ?? null,
  ...l,
});

// typical values to be replaced by product data; sources beside each (values from memory)
const SRC_10456 = 'Typical design value in the range ISO 10456 tabulates (from memory); replace with product data';
const SRC_GUIDE = 'Typical value, common practice for the material (from memory); replace with product data';

const LAYERS: Record<Element, () => DocLayer[]> = {
  // outside → inside: brick outer leaf, mineral wool, block inner leaf, plaster
  wall: () => [
    layer('l1', { name: 'Clay brick outer leaf', materialClass: 'masonry', thickness: 0.1025, conductivity: 0.77, density: 1700, specificHeat: 800, vapourResistanceFactor: 10, source: SRC_GUIDE }),
    layer('l2', { name: 'Mineral wool batt', materialClass: 'insulation', thickness: 0.1, conductivity: 0.035, density: 30, specificHeat: 1030, vapourResistanceFactor: 1, source: SRC_10456 }),
    layer('l3', { name: 'Medium-density concrete block', materialClass: 'masonry', thickness: 0.1, conductivity: 0.51, density: 1400, specificHeat: 1000, vapourResistanceFactor: 10, source: SRC_GUIDE }),
    layer('l4', { name: 'Gypsum plaster', materialClass: 'render', thickness: 0.013, conductivity: 0.4, density: 1000, specificHeat: 1000, vapourResistanceFactor: 10, source: SRC_10456 }),
  ],
  // outside → inside: membrane, PIR board, reinforced concrete deck, plaster
  roof: () => [
    layer('l1', { name: 'Bituminous membrane', materialClass: 'membrane', thickness: 0.005, conductivity: 0.17, density: 1050, specificHeat: 1000, vapourResistanceFactor: 50000, source: SRC_10456 }),
    layer('l2', { name: 'PIR insulation board', materialClass: 'insulation', thickness: 0.12, conductivity: 0.022, density: 32, specificHeat: 1400, vapourResistanceFactor: 60, source: SRC_GUIDE }),
    layer('l3', { name: 'Reinforced concrete deck', materialClass: 'concrete', thickness: 0.15, conductivity: 2.3, density: 2300, specificHeat: 1000, vapourResistanceFactor: 80, source: SRC_10456 }),
    layer('l4', { name: 'Gypsum plaster', materialClass: 'render', thickness: 0.013, conductivity: 0.4, density: 1000, specificHeat: 1000, vapourResistanceFactor: 10, source: SRC_10456 }),
  ],
  // outside (below) → inside: EPS under the slab, reinforced concrete slab, sand-cement screed
  floor: () => [
    layer('l1', { name: 'EPS insulation board', materialClass: 'insulation', thickness: 0.1, conductivity: 0.035, density: 20, specificHeat: 1450, vapourResistanceFactor: 60, source: SRC_10456 }),
    layer('l2', { name: 'Reinforced concrete slab', materialClass: 'concrete', thickness: 0.15, conductivity: 2.3, density: 2300, specificHeat: 1000, vapourResistanceFactor: 80, source: SRC_10456 }),
    layer('l3', { name: 'Sand-cement screed', materialClass: 'concrete', thickness: 0.065, conductivity: 1.4, density: 2000, specificHeat: 1000, vapourResistanceFactor: 50, source: SRC_GUIDE }),
  ],
};

/** ISO 6946 conventional surface resistances: wall horizontal 0.13, roof (heat flow upward) 0.10, floor (downward) 0.17 m²K/W */
const DIRECTION = { wall: 'horizontal', roof: 'upward', floor: 'downward' } as const;

export function defaultDocument(element: Element): WorkbenchDocument {
  const direction = DIRECTION[element];
  return {
    version: 2,
    layers: LAYERS[element](),
    exposure: { ...defaultExposure(), heatFlowDirection: direction, insideSurfaceResistance: ISO6946_RSI[direction] },
  };
}
