import { describe, expect, it } from 'vitest';
import { DEMO_ASSEMBLIES, DEMO_MOISTURE_ASSEMBLIES } from '../../../src/lib/server/seed/demoJob';
import { glaserDiagramSvg, moistureReport, assessDocument } from '../../../src/lib/moisture/index.ts';

describe('moistureReport (server-side pieces for the Report and the Shared view)', () => {
  it('shows the month that condenses most, with both diagrams as SVG strings and twelve rows', () => {
    const r = moistureReport(DEMO_MOISTURE_ASSEMBLIES[0].doc)!;
    const most = r.assessment.glaser.months.reduce((a, m) => (m.condensed > a.condensed ? m : a));
    expect(r.month).toBe(most.month);
    expect(r.diagrams.thickness.startsWith('<svg')).toBe(true);
    expect(r.diagrams.sd).toContain(`Glaser diagram, ${r.monthName}, against s_d`);
    expect(r.rows).toHaveLength(12);
    expect(r.rows[0].where).toMatch(/^Plywood/);
    expect(r.verdict.kind).toBe('accumulates');
    expect(r.deferral).toBe('A hygrothermal specialist and local codes decide.');
  });

  it('is null without a climate', () => {
    const doc = structuredClone(DEMO_ASSEMBLIES[0].doc);
    delete doc.exposure.climate;
    expect(moistureReport(doc)).toBeNull();
  });
});

describe('glaserDiagramSvg', () => {
  it('escapes layer names and places a condensation bar at each condensation plane', () => {
    const doc = structuredClone(DEMO_MOISTURE_ASSEMBLIES[0].doc);
    doc.layers[0].name = 'Ply <18> & "sheathing"';
    const a = assessDocument(doc)!;
    const svg = glaserDiagramSvg(a, 1);
    expect(svg).toContain('Ply &lt;18&gt; &amp; &quot;sheathing&quot;');
    expect(svg).not.toContain('<18>');
    expect((svg.match(/data-condensation=/g) ?? []).length).toBe(a.glaser.months[0].condensationPlanes.length);
    // every coordinate is a finite number
    expect(svg).not.toMatch(/NaN|Infinity/);
  });
});
