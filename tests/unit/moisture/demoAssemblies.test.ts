import { describe, expect, it } from 'vitest';
import { DEMO_ASSEMBLIES, DEMO_MOISTURE_ASSEMBLIES } from '../../../src/lib/server/seed/demoJob';
import { assessDocument, moistureFromDocument, moistureVerdictText } from '../../../src/lib/moisture/index.ts';
import { workbenchDocumentSchema } from '../../../src/lib/schemas/workbench';

const byName = (prefix: string) => [...DEMO_ASSEMBLIES, ...DEMO_MOISTURE_ASSEMBLIES].find((a) => a.name.startsWith(prefix))!;

describe('the demo job under the Harrow Lane climate (ISO 13788 monthly method)', () => {
  it('gives every demo assembly a climate and a moisture verdict', () => {
    for (const a of [...DEMO_ASSEMBLIES, ...DEMO_MOISTURE_ASSEMBLIES]) {
      expect(workbenchDocumentSchema.safeParse(a.doc).success, a.name).toBe(true);
      expect(a.doc.exposure.climate, a.name).toBeDefined();
      const m = assessDocument(a.doc);
      expect(m, a.name).not.toBeNull();
      expect(moistureVerdictText(m!).text.length).toBeGreaterThan(20);
    }
  });

  it('flags the timber frame without a vapour control layer and passes the one with it', () => {
    // common practice: a vapour-tight sheathing on the cold side needs a tighter layer on the warm side
    const without = assessDocument(byName('Stair tower, timber frame without').doc)!;
    expect(without.verdict).toBe('accumulates');
    const withVcl = assessDocument(byName('Stair tower, timber frame with vapour').doc)!;
    expect(withVcl.verdict).not.toBe('accumulates');
    expect(withVcl.glaser.driesOut).toBe(true);
  });

  it('keeps every insulated demo wall clear of mould at the surface (f_Rsi well above f_Rsi,min)', () => {
    for (const a of [...DEMO_ASSEMBLIES, ...DEMO_MOISTURE_ASSEMBLIES]) {
      const m = moistureFromDocument(a.doc)!;
      expect(m.surface.mouldRisk, a.name).toBe(false);
      expect(m.surface.fRsi).toBeGreaterThan(m.surface.fRsiMin!);
    }
  });
});

describe('moistureFromDocument (the command line object)', () => {
  it('has exactly the documented shape, months in calendar order', () => {
    const m = moistureFromDocument(byName('Stair tower, timber frame without').doc)!;
    expect(Object.keys(m).sort()).toEqual(['driesOut', 'maxAccumulated', 'months', 'surface']);
    expect(Object.keys(m.surface).sort()).toEqual(['condensationRisk', 'criticalMonth', 'fRsi', 'fRsiMin', 'mouldRisk']);
    expect(m.months.map((x) => x.month)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    expect(Object.keys(m.months[0]).sort()).toEqual(
      ['accumulated', 'condensationInterfaces', 'condensed', 'evaporated', 'insideTemperature', 'insideVapourPressure', 'month', 'outsideRelativeHumidity', 'outsideTemperature'].sort(),
    );
    // the plywood / glass wool interface is interface 0 (between layers 0 and 1)
    expect(m.months[0].condensationInterfaces).toEqual([0]);
    expect(m.driesOut).toBe(false);
    expect(m.maxAccumulated).toBeGreaterThan(1000);
  });

  it('is null without a climate and names a layer without μ', () => {
    const doc = structuredClone(byName('West wall').doc);
    doc.layers[1].vapourResistanceFactor = null;
    expect(() => moistureFromDocument(doc)).toThrow(/layers\[1\]\.vapourResistanceFactor: is needed for the moisture check/);
    delete doc.exposure.climate;
    expect(moistureFromDocument(doc)).toBeNull();
  });
});
