// the built-in material library: typical values, each with the published table it comes from.
// these are starting points to be replaced by the chosen product's declared data.
import type { MaterialClass } from '../schemas/workbench';
import type { MaterialFields } from './schema';

/**
 * A built-in material: its values (conductivity in W/(m·K), for an air layer the equivalent
 * conductivity d/R of its thickness; vapour-tight layers carry a large finite μ; source is
 * the published table the values come from), a stable key and a starting thickness.
 */
export interface BuiltinMaterial extends MaterialFields {
  /** stable key, kept in materials.builtinKey and in a layer's materialRef as "builtin:<key>" */
  key: string;
  /** typical thickness a new layer starts with, m */
  typicalThickness: number;
}

const ISO10456 = 'ISO 10456:2007 Table 3 (design thermal values of building materials), from memory';
const ISO10456_DRY = 'ISO 10456:2007 Table 3 (design values), λ and ρ from memory; c and μ from the same table';
const EN1745 = 'EN 1745:2012 Annex A (thermal values of masonry at the given gross dry density), from memory';
const CIBSE = 'CIBSE Guide A (2015) chapter 3, table of thermal properties of building materials (table number not checked), from memory';
const ASHRAE = 'ASHRAE Handbook—Fundamentals (2017) ch. 26 Table 1 (building and insulating materials), from memory';
const EN13162 = 'typical declared λ of factory-made mineral wool to EN 13162; c and μ from ISO 10456:2007 Table 4, from memory';
const FOAM = (standard: string) => `typical declared λ of ${standard} boards; c and μ from ISO 10456:2007 Table 4, from memory`;
const METAL = 'ISO 10456:2007 Table 3 (metals), from memory';
const MEMBRANE = 'ISO 10456:2007 Table 3 (plastics, rubbers and sealants), from memory';

/** ISO 6946:2017 Table 8: thermal resistance of unventilated air layers with high-emissivity faces, horizontal heat flow, m²K/W */
export const ISO6946_TABLE8_HORIZONTAL: ReadonlyArray<readonly [thicknessMm: number, resistance: number]> = [
  [5, 0.11],
  [7, 0.13],
  [10, 0.15],
  [15, 0.17],
  [25, 0.18],
  [50, 0.18],
  [100, 0.18],
  [300, 0.18],
];

function airLayer(thicknessMm: number, resistance: number): BuiltinMaterial {
  const d = thicknessMm / 1000;
  return {
    key: `air-unventilated-${thicknessMm}mm`,
    name: `Unventilated air layer, ${thicknessMm} mm`,
    materialClass: 'air',
    conductivity: d / resistance,
    density: 1.2,
    specificHeat: 1005,
    vapourResistanceFactor: 1,
    typicalThickness: d,
    source: `ISO 6946:2017 Table 8, R = ${resistance.toFixed(2)} m²K/W for ${thicknessMm} mm with horizontal heat flow (from memory); λ_eq = d / R`,
    notes:
      'Equivalent conductivity valid only at this thickness, horizontal heat flow and high-emissivity faces. ' +
      'ISO 6946 governs the real value (heat-flow direction, emissivity, ventilation); change the thickness and the resistance changes with it.',
  };
}

const solid = (
  key: string,
  name: string,
  materialClass: MaterialClass,
  conductivity: number,
  density: number,
  specificHeat: number,
  vapourResistanceFactor: number,
  typicalThicknessMm: number,
  source: string,
  notes = '',
): BuiltinMaterial => ({
  key,
  name,
  materialClass,
  conductivity,
  density,
  specificHeat,
  vapourResistanceFactor,
  typicalThickness: typicalThicknessMm / 1000,
  source,
  notes,
});

/** at least five per class where the trade uses that many; every value typical, not a product's */
export const BUILTIN_MATERIALS: readonly BuiltinMaterial[] = [
  // masonry
  solid('clay-brick-outer-1700', 'Clay brick, exposed outer leaf (1700 kg/m³)', 'masonry', 0.77, 1700, 800, 10, 102.5, CIBSE, 'Brickwork with mortar joints at the moisture content of an exposed leaf.'),
  solid('clay-brick-protected-1700', 'Clay brick, protected (1700 kg/m³)', 'masonry', 0.56, 1700, 800, 10, 215, CIBSE, 'Brickwork protected from the weather (inner leaf or behind insulation and render).'),
  solid('clay-brick-engineering-2100', 'Engineering clay brick (2100 kg/m³)', 'masonry', 1.0, 2100, 800, 50, 102.5, EN1745),
  solid('calcium-silicate-brick-1800', 'Calcium silicate brick (1800 kg/m³)', 'masonry', 1.0, 1800, 1000, 15, 102.5, EN1745),
  solid('concrete-block-dense-2000', 'Dense aggregate concrete block (2000 kg/m³)', 'masonry', 1.13, 2000, 1000, 15, 100, CIBSE),
  solid('concrete-block-medium-1400', 'Medium-density concrete block (1400 kg/m³)', 'masonry', 0.51, 1400, 1000, 10, 100, CIBSE),
  solid('aerated-concrete-block-600', 'Aerated concrete block (600 kg/m³)', 'masonry', 0.18, 600, 1000, 10, 100, EN1745),
  solid('sandstone-2300', 'Sandstone (2300 kg/m³)', 'masonry', 2.3, 2300, 1000, 40, 150, ISO10456),
  solid('limestone-hard-2200', 'Limestone, hard (2200 kg/m³)', 'masonry', 1.7, 2200, 1000, 200, 150, ISO10456),
  solid('granite-2700', 'Granite (2700 kg/m³)', 'masonry', 2.8, 2700, 1000, 10000, 30, ISO10456),

  // concrete
  solid('concrete-reinforced-2400', 'Reinforced concrete, 2 % steel (2400 kg/m³)', 'concrete', 2.5, 2400, 1000, 130, 200, ISO10456),
  solid('concrete-dense-2200', 'Dense concrete (2200 kg/m³)', 'concrete', 1.65, 2200, 1000, 120, 150, ISO10456),
  solid('concrete-medium-2000', 'Medium-density concrete (2000 kg/m³)', 'concrete', 1.35, 2000, 1000, 100, 150, ISO10456),
  solid('concrete-lightweight-1200', 'Lightweight aggregate concrete (1200 kg/m³)', 'concrete', 0.44, 1200, 1000, 10, 150, ASHRAE),
  solid('screed-cement-sand-2000', 'Cement–sand screed (2000 kg/m³)', 'concrete', 1.4, 2000, 1000, 50, 65, ISO10456),
  solid('foamed-concrete-600', 'Foamed concrete (600 kg/m³)', 'concrete', 0.16, 600, 1000, 6, 100, ASHRAE),

  // timber
  solid('softwood-500', 'Softwood, structural (500 kg/m³)', 'timber', 0.13, 500, 1600, 50, 47, ISO10456_DRY),
  solid('softwood-cladding-450', 'Softwood cladding boards (450 kg/m³)', 'timber', 0.12, 450, 1600, 50, 19, ISO10456_DRY, 'Boards on a ventilated batten space: ISO 6946 lets a well-ventilated cladding be left out and R_se taken as R_si; kept here as a layer.'),
  solid('hardwood-700', 'Hardwood (700 kg/m³)', 'timber', 0.18, 700, 1600, 200, 25, ISO10456_DRY),
  solid('plywood-500', 'Plywood (500 kg/m³)', 'timber', 0.13, 500, 1600, 200, 18, ISO10456),
  solid('osb-650', 'Oriented strand board, OSB (650 kg/m³)', 'timber', 0.13, 650, 1700, 50, 15, ISO10456),
  solid('particleboard-600', 'Particleboard (600 kg/m³)', 'timber', 0.14, 600, 1700, 50, 18, ISO10456),
  solid('clt-470', 'Cross-laminated timber panel (470 kg/m³)', 'timber', 0.12, 470, 1600, 50, 100, ISO10456_DRY),

  // insulation
  solid('mineral-wool-glass-20', 'Glass mineral wool batt (20 kg/m³)', 'insulation', 0.037, 20, 1030, 1, 100, EN13162),
  solid('mineral-wool-stone-100', 'Stone mineral wool slab (100 kg/m³)', 'insulation', 0.036, 100, 1030, 1, 100, EN13162),
  solid('mineral-wool-render-slab-140', 'Stone wool slab for rendered facades (140 kg/m³)', 'insulation', 0.038, 140, 1030, 1, 120, EN13162),
  solid('eps-20', 'Expanded polystyrene, EPS (20 kg/m³)', 'insulation', 0.035, 20, 1450, 60, 100, FOAM('EN 13163 EPS')),
  solid('xps-35', 'Extruded polystyrene, XPS (35 kg/m³)', 'insulation', 0.034, 35, 1450, 150, 100, FOAM('EN 13164 XPS')),
  solid('pir-32', 'Polyisocyanurate foam, PIR (32 kg/m³)', 'insulation', 0.022, 32, 1400, 60, 80, FOAM('EN 13165 PIR (gas-tight facings not included)')),
  solid('phenolic-35', 'Phenolic foam (35 kg/m³)', 'insulation', 0.02, 35, 1400, 35, 60, FOAM('EN 13166 phenolic foam')),
  solid('wood-fibre-board-160', 'Wood fibre insulation board (160 kg/m³)', 'insulation', 0.04, 160, 2100, 5, 60, FOAM('EN 13171 wood fibre')),
  solid('wood-fibre-sarking-240', 'Wood fibre sarking board (240 kg/m³)', 'insulation', 0.048, 240, 2100, 5, 35, FOAM('EN 13171 wood fibre')),
  solid('cellulose-fill-50', 'Cellulose loose fill (50 kg/m³)', 'insulation', 0.04, 50, 2000, 2, 150, ASHRAE),
  solid('cork-board-120', 'Expanded cork board (120 kg/m³)', 'insulation', 0.042, 120, 1560, 10, 60, FOAM('EN 13170 expanded cork')),

  // boards
  solid('gypsum-plasterboard-700', 'Gypsum plasterboard (700 kg/m³)', 'board', 0.21, 700, 1000, 10, 12.5, ISO10456),
  solid('gypsum-fibreboard-1150', 'Gypsum fibreboard (1150 kg/m³)', 'board', 0.32, 1150, 1100, 13, 12.5, ISO10456),
  solid('fibre-cement-board-1400', 'Fibre cement board (1400 kg/m³)', 'board', 0.35, 1400, 1000, 50, 8, CIBSE),
  solid('cement-particleboard-1200', 'Cement-bonded particleboard (1200 kg/m³)', 'board', 0.23, 1200, 1500, 50, 12, ISO10456),
  solid('mdf-700', 'Medium-density fibreboard, MDF (700 kg/m³)', 'board', 0.14, 700, 1700, 20, 12, ISO10456),
  solid('calcium-silicate-board-870', 'Calcium silicate board (870 kg/m³)', 'board', 0.29, 870, 1000, 20, 12, CIBSE),

  // metals
  solid('steel-7800', 'Steel (7800 kg/m³)', 'metal', 50, 7800, 450, 1_000_000, 0.5, METAL, 'Vapour-tight: μ is taken as 10⁶ to keep a finite number.'),
  solid('stainless-steel-7900', 'Stainless steel (7900 kg/m³)', 'metal', 17, 7900, 500, 1_000_000, 0.7, METAL, 'Vapour-tight: μ is taken as 10⁶ to keep a finite number.'),
  solid('aluminium-alloy-2800', 'Aluminium alloy (2800 kg/m³)', 'metal', 160, 2800, 880, 1_000_000, 1, METAL, 'Vapour-tight: μ is taken as 10⁶ to keep a finite number.'),
  solid('copper-8900', 'Copper (8900 kg/m³)', 'metal', 380, 8900, 380, 1_000_000, 0.7, METAL, 'Vapour-tight: μ is taken as 10⁶ to keep a finite number.'),
  solid('zinc-7200', 'Zinc sheet (7200 kg/m³)', 'metal', 110, 7200, 380, 1_000_000, 0.7, METAL, 'Vapour-tight: μ is taken as 10⁶ to keep a finite number.'),

  // membranes
  solid('polyethylene-vcl-980', 'Polyethylene vapour control layer (980 kg/m³)', 'membrane', 0.5, 980, 1800, 100_000, 0.2, MEMBRANE),
  solid('breather-membrane-pp', 'Breather membrane, spun-bonded polypropylene', 'membrane', 0.22, 910, 1800, 40, 0.5, MEMBRANE, 'λ, ρ and c of solid polypropylene; μ ≈ 40 gives the low s_d (about 0.02 m) of a vapour-open membrane (from memory).'),
  solid('bitumen-felt-1100', 'Bituminous felt (1100 kg/m³)', 'membrane', 0.23, 1100, 1000, 50_000, 3, MEMBRANE),
  solid('epdm-1150', 'EPDM rubber sheet (1150 kg/m³)', 'membrane', 0.25, 1150, 1000, 6000, 1.2, MEMBRANE),
  solid('pvc-sheet-1390', 'PVC roofing sheet (1390 kg/m³)', 'membrane', 0.17, 1390, 900, 50_000, 1.5, MEMBRANE),

  // air layers: equivalent conductivity for their thickness
  airLayer(10, 0.15),
  airLayer(15, 0.17),
  airLayer(25, 0.18),
  airLayer(50, 0.18),
  airLayer(100, 0.18),

  // renders and plasters
  solid('cement-sand-render-1800', 'Cement–sand render (1800 kg/m³)', 'render', 1.0, 1800, 1000, 20, 20, ISO10456),
  solid('lime-render-1600', 'Lime render (1600 kg/m³)', 'render', 0.8, 1600, 1000, 10, 20, ISO10456),
  solid('thin-coat-render-1800', 'Thin-coat polymer render on insulation (1800 kg/m³)', 'render', 0.7, 1800, 1000, 40, 8, CIBSE),
  solid('gypsum-plaster-dense-1300', 'Dense gypsum plaster (1300 kg/m³)', 'render', 0.57, 1300, 1000, 10, 13, CIBSE),
  solid('gypsum-plaster-light-600', 'Lightweight gypsum plaster (600 kg/m³)', 'render', 0.18, 600, 1000, 10, 13, ISO10456),
  solid('clay-plaster-1500', 'Clay plaster (1500 kg/m³)', 'render', 0.7, 1500, 1000, 8, 20, ISO10456_DRY),
];

export function builtinMaterial(key: string): BuiltinMaterial | undefined {
  return BUILTIN_MATERIALS.find((m) => m.key === key);
}

/** the thickness a new layer of a class starts with when its material names none, m */
export const CLASS_TYPICAL_THICKNESS: Record<MaterialClass, number> = {
  masonry: 0.1,
  concrete: 0.15,
  timber: 0.018,
  insulation: 0.1,
  board: 0.0125,
  metal: 0.0007,
  membrane: 0.0005,
  air: 0.025,
  render: 0.015,
};

/** the names the UI uses for the classes */
export const CLASS_LABELS: Record<MaterialClass, string> = {
  masonry: 'Masonry',
  concrete: 'Concrete',
  timber: 'Timber',
  insulation: 'Insulation',
  board: 'Boards',
  metal: 'Metals',
  membrane: 'Membranes',
  air: 'Air layers',
  render: 'Renders and plasters',
};
