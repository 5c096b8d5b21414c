import { describe, expect, it } from 'vitest';
import { assessMoisture, moistureVerdictText, glaserYear, lowerHull, moistureSupply, insideVapourPressure, type Climate, type MoistureLayer } from '../../../src/lib/moisture/index.ts';

// layer values: ISO 10456:2007 Table 3 typical values (from memory), as in the built-in library
const plywood: MoistureLayer = { name: 'Plywood sheathing', thickness: 0.018, conductivity: 0.13, vapourResistanceFactor: 200 };
const wool: MoistureLayer = { name: 'Glass wool', thickness: 0.14, conductivity: 0.037, vapourResistanceFactor: 1 };
const vcl: MoistureLayer = { name: 'Polyethylene VCL', thickness: 0.0002, conductivity: 0.5, vapourResistanceFactor: 100_000 };
const board: MoistureLayer = { name: 'Plasterboard', thickness: 0.0125, conductivity: 0.21, vapourResistanceFactor: 10 };

const constantYear = (temperature: number, relativeHumidity: number, indoor: Climate['indoor']): Climate => ({
  months: Array.from({ length: 12 }, () => ({ temperature, relativeHumidity })),
  indoor,
});

/** a cool inland year of our own, with frosty winters, indoor 20 °C at humidity class 3 */
const harrowLane: Climate = {
  months: [
    [-1.0, 88], [0.2, 85], [3.8, 80], [8.2, 74], [12.8, 72], [16.0, 72], [18.2, 71], [17.7, 74], [14.0, 79], [9.4, 84], [4.4, 88], [0.6, 89],
  ].map(([temperature, relativeHumidity]) => ({ temperature, relativeHumidity })),
  indoor: { temperature: 20, humidityClass: 3 },
};

describe('lowerHull (the taut vapour line under the saturation line)', () => {
  it('keeps only the points below the chord, as a string pulled taut would', () => {
    // points: (0,0) (1,5) (2,0.5) (3,5) (4,2): the string from the first to the last touches (2,0.5) only
    expect(lowerHull([0, 1, 2, 3, 4], [0, 5, 0.5, 5, 2], 0, 4)).toEqual([0, 2, 4]);
    // a straight line touches nothing between
    expect(lowerHull([0, 1, 2], [0, 10, 2], 0, 2)).toEqual([0, 2]);
  });
});

describe('moistureSupply and insideVapourPressure (ISO 13788:2012 Annex A, from memory)', () => {
  it('gives 810 Pa for class 3 at 0 °C and below, falling linearly to zero at 20 °C', () => {
    expect(moistureSupply(3, -5)).toBe(810);
    expect(moistureSupply(3, 10)).toBeCloseTo(405, 10);
    expect(moistureSupply(3, 25)).toBe(0);
    expect(moistureSupply(1, 0)).toBe(270);
    expect(moistureSupply(5, 0)).toBe(1350);
  });
  it('adds the supply times the safety factor 1.10 to the outdoor vapour pressure', () => {
    // 0 °C, 80 %: p_e = 0.8 × 610.5 = 488.4 Pa; class 2: + 1.10 × 540 = 594 Pa → 1082.4 Pa
    expect(insideVapourPressure({ temperature: 20, humidityClass: 2 }, { temperature: 0, relativeHumidity: 80 })).toBeCloseTo(1082.4, 6);
  });
});

describe('glaserYear: a timber frame worked by hand (ISO 13788:2012 clause 7, worked in this file)', () => {
  // one month at θ_e = 0 °C, φ_e = 80 %; θ_i = 20 °C, φ_i = 50 %; R_se 0.04, R_si 0.13 m²K/W.
  // R: plywood 0.018/0.13 = 0.138462, wool 0.14/0.037 = 3.783784, board 0.0125/0.21 = 0.059524;
  // R_T = 0.04 + 0.138462 + 3.783784 + 0.059524 + 0.13 = 4.151769 m²K/W.
  // plywood / wool: θ = 20 × (0.04 + 0.138462)/4.151769 = 0.859689 °C, p_sat = 610.5·exp(17.269·0.859689/238.159689) = 649.767 Pa.
  // s_d: plywood 200 × 0.018 = 3.6 m, wool 0.14 m, board 0.125 m; total 3.865 m.
  // p_e = 0.8 × 610.5 = 488.4 Pa; p_i = 0.5 × 2336.951 = 1168.476 Pa.
  // the straight line at s = 3.6 m: 488.4 + 680.076 × 3.6/3.865 = 1121.85 Pa > 649.767 Pa: it crosses the
  // saturation line, so the line bends at the plywood face.
  // in: 2e-10 × (1168.476 − 649.767)/0.265 = 3.91478e-7; out: 2e-10 × (649.767 − 488.4)/3.6 = 8.9649e-9 kg/(m²s);
  // condensed in a 31-day January: (3.91478e-7 − 8.9649e-9) × 2 678 400 s = 1.02452 kg/m² = 1024.52 g/m².
  const month: Climate = constantYear(0, 80, { temperature: 20, relativeHumidity: 50 });

  it('condenses 1024.5 g/m² at the plywood face in January without a vapour control layer', () => {
    const y = glaserYear([plywood, wool, board], month);
    const jan = y.months[0];
    expect(jan.planes[1].temperature).toBeCloseTo(0.859689, 5);
    expect(jan.planes[1].saturation).toBeCloseTo(649.767, 2);
    expect(jan.insideVapourPressure).toBeCloseTo(1168.476, 2);
    expect(jan.condensationPlanes).toEqual([1]);
    expect(jan.planes[1].vapour).toBeCloseTo(649.767, 2);
    // every month condenses: the start month is January and the first month's amount is the one above
    expect(y.startMonth).toBe(1);
    expect(jan.condensed).toBeCloseTo(1024.52, 1);
    expect(y.driesOut).toBe(false);
  });

  it('does not condense with a polyethylene vapour control layer behind the board', () => {
    // s_d total 3.6 + 0.14 + 20 + 0.125 = 23.865 m; the line at the plywood face:
    // 488.4 + 680.076 × 3.6/23.865 = 590.99 Pa < 649.767 Pa: below saturation, no condensation
    const y = glaserYear([plywood, wool, vcl, board], month);
    expect(y.months[0].planes[1].vapour).toBeCloseTo(590.99, 1);
    expect(y.condenses).toBe(false);
    expect(y.months.every((m) => m.condensed === 0)).toBe(true);
  });

  it('over a temperate year: without the vapour control layer water accumulates, with it none is left', () => {
    const without = assessMoisture([plywood, wool, board], harrowLane);
    expect(without.verdict).toBe('accumulates');
    expect(without.glaser.driesOut).toBe(false);
    // the standard's start month: the first month that condenses after one that does not (October here)
    expect(without.glaser.startMonth).toBe(10);
    const withVcl = assessMoisture([plywood, wool, vcl, board], harrowLane);
    expect(withVcl.glaser.driesOut).toBe(true);
    expect(withVcl.verdict).not.toBe('accumulates');
    expect(withVcl.glaser.maxAccumulated).toBeLessThan(without.glaser.maxAccumulated / 100);
  });
});

describe('glaserYear: masonry and vapour-open walls (ISO 13788:2012 clause 7; expectations common practice)', () => {
  // solid brick with internal insulation and no vapour control: condenses at the cold brick face in
  // winter; the vapour-open brick (μ 10) lets it dry out by summer
  const brick: MoistureLayer = { name: 'Clay brick', thickness: 0.215, conductivity: 0.77, vapourResistanceFactor: 10 };
  const mild: Climate = {
    months: [
      [5.6, 86], [5.7, 84], [7.2, 82], [9.0, 79], [12.0, 78], [14.6, 79], [16.6, 79], [16.8, 80], [15.0, 81], [12.2, 84], [8.8, 86], [6.6, 87],
    ].map(([temperature, relativeHumidity]) => ({ temperature, relativeHumidity })),
    indoor: { temperature: 20, humidityClass: 2 },
  };

  it('condenses in winter at the brick face and dries out by summer', () => {
    const a = assessMoisture([brick, { ...wool, thickness: 0.06 }, board], mild);
    const g = a.glaser;
    expect(g.months[0].condensationPlanes).toEqual([1]);
    expect(g.months[0].condensed).toBeGreaterThan(0);
    expect(g.months[6].accumulated).toBe(0); // July
    expect(g.maxAccumulated).toBeGreaterThan(0);
    expect(g.driesOut).toBe(true);
    expect(a.verdict).toBe('driesOut');
    // the mass balance: what condensed over the year evaporated again
    const condensed = g.months.reduce((s, m) => s + m.condensed, 0);
    const evaporated = g.months.reduce((s, m) => s + m.evaporated, 0);
    expect(evaporated).toBeCloseTo(condensed, 6);
    // over a kilogram at one interface: the verdict adds the trade's usual 500 g/m² caution (common practice)
    expect(g.maxAccumulated).toBeGreaterThan(500);
    expect(moistureVerdictText(a).text).toMatch(/more than the 500 g\/m² often taken as the most an interface may hold/);
  });

  it('finds no condensation where the outside is vapour-open and the inside tight', () => {
    // wood fibre board outside (μ 5, s_d 0.3 m), wool, polyethylene VCL (s_d 20 m), plasterboard, Harrow Lane year
    const fibre: MoistureLayer = { name: 'Wood fibre board', thickness: 0.06, conductivity: 0.04, vapourResistanceFactor: 5 };
    const a = assessMoisture([fibre, wool, vcl, board], harrowLane);
    expect(a.verdict).toBe('none');
    expect(a.glaser.maxAccumulated).toBe(0);
    expect(a.glaser.months.every((m) => m.condensationPlanes.length === 0)).toBe(true);
  });

  it('keeps the vapour line at or under the saturation line at every plane in every month', () => {
    const a = assessMoisture([plywood, wool, board], harrowLane);
    for (const m of a.glaser.months) for (const p of m.planes) expect(p.vapour).toBeLessThanOrEqual(p.saturation + 1e-9);
  });
});
