import { describe, it, expect } from 'vitest';
import { DEMO_ASSEMBLIES } from '../../../src/lib/server/seed/demoJob';
import { selectFigures } from '../../../src/lib/workbench/store';
import { workbenchDocumentSchema } from '../../../src/lib/schemas/workbench';

const figures = (prefix: string) => {
  const a = DEMO_ASSEMBLIES.find((x) => x.name.startsWith(prefix));
  if (!a) throw new Error(prefix);
  return selectFigures({ doc: a.doc })!;
};

describe('DEMO_ASSEMBLIES', () => {
  it('are three valid workbench documents with the default exposure', () => {
    expect(DEMO_ASSEMBLIES).toHaveLength(3);
    for (const a of DEMO_ASSEMBLIES) {
      expect(workbenchDocumentSchema.safeParse(a.doc).success, a.name).toBe(true);
      expect(new Set(a.doc.layers.map((l) => l.id)).size).toBe(a.doc.layers.length);
      for (const l of a.doc.layers) expect(l.materialRef).toMatch(/^builtin:/);
    }
  });

  it('contrast plainly in decrement factor and time lag (ISO 13786 periodic analysis)', () => {
    const heavy = figures('West wall');
    const timber = figures('Stair tower');
    const panel = figures('Plant room');
    // common practice: heavy masonry behind outside insulation lags 10 h or more and passes about a tenth of the swing
    expect(heavy.periodic.timeLag / 3600).toBeGreaterThan(10);
    expect(heavy.periodic.decrementFactor).toBeLessThan(0.2);
    // a thin steel-faced foam panel has almost no mass: lag about an hour, decrement near 1 (common practice)
    expect(panel.periodic.timeLag / 3600).toBeLessThan(2);
    expect(panel.periodic.decrementFactor).toBeGreaterThan(0.9);
    // the light timber frame sits between them
    expect(timber.periodic.timeLag).toBeGreaterThan(panel.periodic.timeLag);
    expect(timber.periodic.timeLag).toBeLessThan(heavy.periodic.timeLag);
    // all three are insulated walls of similar U (so the contrast is about mass, not insulation)
    for (const f of [heavy, timber, panel]) expect(f.steady.uValue).toBeLessThan(0.35);
  });

  it('name the homogeneous-layer simplification of the studded insulation', () => {
    const timber = DEMO_ASSEMBLIES.find((x) => x.name.startsWith('Stair tower'))!;
    expect(timber.doc.layers.find((l) => l.id === 'tf-wool')?.note).toMatch(/homogeneous layer/);
  });
});
