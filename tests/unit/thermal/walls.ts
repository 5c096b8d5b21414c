// walls of our own scenario for the engine tests (not a test file itself). material values are typical handbook
// figures: ISO 10456:2007 Table 3 and CIBSE Guide A (2015) Table 3.x (from memory); each is a plausible design value.
import type { Layer } from '../../../src/lib/thermal/index.ts';

/**
 * the heavy demo wall of the Harrow Lane re-cladding: render, stone wool, brick, dense concrete lining, plaster
 * (about 590 kJ/m²K)
 */
export const heavyDemoWall: Layer[] = [
  { name: 'Cement-sand render', thickness: 0.02, conductivity: 1.0, density: 1800, specificHeat: 1000 },
  { name: 'Stone wool slab', thickness: 0.12, conductivity: 0.036, density: 100, specificHeat: 1030 },
  { name: 'Clay brick', thickness: 0.215, conductivity: 0.77, density: 1700, specificHeat: 800 },
  { name: 'Dense concrete', thickness: 0.15, conductivity: 2.0, density: 2400, specificHeat: 1000 },
  { name: 'Gypsum plaster', thickness: 0.013, conductivity: 0.4, density: 1000, specificHeat: 1000 },
];

/** the light timber annex wall of the same job */
export const timberAnnexWall: Layer[] = [
  { name: 'Larch cladding boards', thickness: 0.022, conductivity: 0.13, density: 550, specificHeat: 1600 },
  { name: 'Wood-fibre sheathing', thickness: 0.06, conductivity: 0.045, density: 180, specificHeat: 2100 },
  { name: 'Mineral wool between studs', thickness: 0.145, conductivity: 0.04, density: 30, specificHeat: 1030 },
  { name: 'OSB service board', thickness: 0.015, conductivity: 0.13, density: 600, specificHeat: 1700 },
  { name: 'Plasterboard', thickness: 0.0125, conductivity: 0.25, density: 900, specificHeat: 1000 },
];
