import { describe, it, expect } from 'vitest';
import { diffBuildUps } from '../../../src/lib/workbench/diff';
import { DEMO_ASSEMBLIES } from '../../../src/lib/server/seed/demoJob';

const base = () => structuredClone(DEMO_ASSEMBLIES[0].doc);

describe('diffBuildUps', () => {
  it('finds nothing between a document and its copy', () => {
    expect(diffBuildUps(base(), base())).toEqual({ added: [], removed: [], changed: [], reordered: false, exposureChanged: false });
  });

  it('names added, removed and changed layers, a new order and other exposure settings', () => {
    const mine = base();
    const theirs = base();
    theirs.layers[1] = { ...theirs.layers[1], thickness: 0.16, conductivity: 0.035 };
    theirs.layers.push({ ...theirs.layers[0], id: 'new-one', name: 'Lime render' });
    theirs.layers.splice(3, 1); // plaster gone
    [theirs.layers[0], theirs.layers[2]] = [theirs.layers[2], theirs.layers[0]];
    theirs.exposure = { ...theirs.exposure, insideSurfaceResistance: 0.17 };
    const d = diffBuildUps(mine, theirs);
    expect(d.added).toEqual(['Lime render']);
    expect(d.removed).toEqual(['Dense gypsum plaster (1300 kg/m³)']);
    expect(d.changed).toEqual([{ name: 'Stone wool slab for rendered facades (140 kg/m³)', fields: ['thickness', 'conductivity'] }]);
    expect(d.reordered).toBe(true);
    expect(d.exposureChanged).toBe(true);
  });
});
