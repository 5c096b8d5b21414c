// the interstitial condensation check of ISO 13788:2012 clause 7 (the Glaser method), month by
// month: a steady temperature profile through the layers, the saturation pressure at every
// plane, the vapour pressure line drawn taut under the saturation line between the outdoor and
// indoor vapour pressures, and the mass condensed at (or evaporated from) each plane.
import { DAYS_IN_MONTH, insideVapourPressure, type Climate } from './climate.ts';
import { saturationPressure, vapourPressure } from './saturation.ts';

/** one layer as the method needs it; ordered from the OUTSIDE face (index 0) to the INSIDE face */
export interface MoistureLayer {
  name: string;
  /** m */
  thickness: number;
  /** W/(m·K) */
  conductivity: number;
  /** water-vapour resistance factor μ, – */
  vapourResistanceFactor: number;
}

/** the water-vapour permeability of still air used by the method, kg/(m·s·Pa) (ISO 13788:2012 7.2, from memory) */
export const DELTA_0 = 2e-10;

/** surface resistances of the interstitial check, m²K/W: those of ISO 6946 for horizontal heat flow (ISO 13788:2012 4.3, from memory) */
export const INTERSTITIAL_RSI = 0.13;
export const INTERSTITIAL_RSE = 0.04;

/** a plane of the build-up: k = 0 the outside surface, k = 1…n−1 the interfaces, k = n the inside surface */
export interface PlaneState {
  /** diffusion-equivalent air layer thickness from the outside surface, m */
  sd: number;
  /** thickness from the outside surface, m */
  x: number;
  /** °C */
  temperature: number;
  /** Pa */
  saturation: number;
  /** Pa: the vapour pressure line */
  vapour: number;
  /** kg/(m²·s): positive condenses at this plane, negative evaporates from it */
  rate: number;
  /** g/m² condensed here in the month */
  condensed: number;
  /** g/m² evaporated from here in the month */
  evaporated: number;
  /** g/m² held here at the end of the month */
  accumulated: number;
}

export interface GlaserMonth {
  /** 1…12 */
  month: number;
  outsideTemperature: number;
  /** % */
  outsideRelativeHumidity: number;
  insideTemperature: number;
  /** Pa */
  outsideVapourPressure: number;
  /** Pa */
  insideVapourPressure: number;
  planes: PlaneState[];
  /** planes k where vapour condenses this month (interfaces, or a surface the air saturates) */
  condensationPlanes: number[];
  /** g/m², summed over the planes */
  condensed: number;
  evaporated: number;
  accumulated: number;
}

export interface GlaserYear {
  /** calendar order, January first */
  months: GlaserMonth[];
  /** 1…12: the month the accumulation starts (ISO 13788:2012 7.3, from memory); null when nothing condenses */
  startMonth: number | null;
  /** g/m²: the largest total held at the end of any month */
  maxAccumulated: number;
  /** the month (1…12) and plane of the largest amount held at one plane; null when nothing condenses */
  maxAt: { month: number; plane: number } | null;
  /** nothing is held at the end of the twelve months from the start month */
  driesOut: boolean;
  /** condensation occurs in some month */
  condenses: boolean;
  /** the build-up's planes: s_d and x from the outside surface */
  sd: number[];
  x: number[];
}

/** s_d = μ·d, m (ISO 13788:2012 3.1, from memory) */
export function diffusionThickness(layer: MoistureLayer): number {
  return layer.vapourResistanceFactor * layer.thickness;
}

/**
 * the lower convex hull of points sorted by s, from the first to the last: a string pulled taut
 * from the first point to the last that may not pass above any point between (the vapour
 * pressure line under the saturation line, ISO 13788:2012 7.2, from memory). returns the indices
 * of its vertices.
 */
export function lowerHull(s: number[], p: number[], from: number, to: number): number[] {
  const hull: number[] = [];
  for (let k = from; k <= to; k++) {
    while (hull.length >= 2) {
      const a = hull[hull.length - 2];
      const b = hull[hull.length - 1];
      // drop b when it lies on or above the segment a → k
      const cross = (s[b] - s[a]) * (p[k] - p[a]) - (p[b] - p[a]) * (s[k] - s[a]);
      if (cross <= 0) hull.pop();
      else break;
    }
    hull.push(k);
  }
  return hull;
}

interface Geometry {
  sd: number[];
  x: number[];
  /** R_se + Σ R of the layers outside each plane, m²K/W */
  rOut: number[];
  rTotal: number;
}

function geometry(layers: MoistureLayer[], rse: number, rsi: number): Geometry {
  const sd = [0];
  const x = [0];
  const rOut = [rse];
  for (const l of layers) {
    sd.push(sd[sd.length - 1] + diffusionThickness(l));
    x.push(x[x.length - 1] + l.thickness);
    rOut.push(rOut[rOut.length - 1] + l.thickness / l.conductivity);
  }
  return { sd, x, rOut, rTotal: rOut[rOut.length - 1] + rsi };
}

/**
 * one month: the vapour line and the rate at each plane, given which interfaces hold water at the
 * start of the month (their vapour pressure is the saturation pressure, ISO 13788:2012 7.3)
 */
function monthRates(g: Geometry, te: number, ti: number, pe: number, pi: number, wet: boolean[]) {
  const n = g.sd.length - 1;
  const temperature = g.rOut.map((r) => te + ((ti - te) * r) / g.rTotal);
  const saturation = temperature.map(saturationPressure);
  // the surfaces: the air's vapour pressure, unless the air is above saturation at the surface
  const p = saturation.slice();
  const surfaceCondenses = [pe > saturation[0], pi > saturation[n]];
  p[0] = Math.min(pe, saturation[0]);
  p[n] = Math.min(pi, saturation[n]);
  // anchors: both surfaces and every wet interface; between anchors the taut line
  const anchors = [0];
  for (let k = 1; k < n; k++) if (wet[k]) anchors.push(k);
  anchors.push(n);
  const vertices = new Set<number>();
  for (let a = 0; a + 1 < anchors.length; a++) {
    for (const v of lowerHull(g.sd, p, anchors[a], anchors[a + 1])) vertices.add(v);
  }
  const sorted = [...vertices].sort((a, b) => a - b);
  const vapour = new Array<number>(n + 1);
  for (let i = 0; i + 1 < sorted.length; i++) {
    const a = sorted[i];
    const b = sorted[i + 1];
    for (let k = a; k <= b; k++) vapour[k] = p[a] + ((p[b] - p[a]) * (g.sd[k] - g.sd[a])) / (g.sd[b] - g.sd[a]);
  }
  // the rate at a vertex: vapour arriving from the inside minus vapour leaving to the outside
  const rate = new Array<number>(n + 1).fill(0);
  for (let i = 1; i + 1 < sorted.length; i++) {
    const a = sorted[i - 1];
    const c = sorted[i];
    const b = sorted[i + 1];
    const fromInside = (DELTA_0 * (vapour[b] - vapour[c])) / (g.sd[b] - g.sd[c]);
    const toOutside = (DELTA_0 * (vapour[c] - vapour[a])) / (g.sd[c] - g.sd[a]);
    rate[c] = fromInside - toOutside;
  }
  return { temperature, saturation, vapour, rate, surfaceCondenses };
}

const SECONDS_PER_DAY = 86400;
/** kg/(m²·s) below which a rate is taken as zero (round-off of the hull) */
const RATE_EPS = 1e-15;

/** the interstitial check over a year of months (ISO 13788:2012 clause 7, from memory) */
export function glaserYear(layers: MoistureLayer[], climate: Climate, options: { rsi?: number; rse?: number } = {}): GlaserYear {
  const rsi = options.rsi ?? INTERSTITIAL_RSI;
  const rse = options.rse ?? INTERSTITIAL_RSE;
  if (climate.months.length !== 12) throw new Error('the climate needs 12 months');
  if (layers.length === 0) throw new Error('the build-up needs at least one layer');
  const g = geometry(layers, rse, rsi);
  const n = layers.length;
  const ti = climate.indoor.temperature;
  const pes = climate.months.map((m) => vapourPressure(m.temperature, m.relativeHumidity));
  const pis = climate.months.map((m) => insideVapourPressure(climate.indoor, m));
  const dry = new Array<boolean>(n + 1).fill(false);

  // which months condense in a dry build-up
  const condensesDry = climate.months.map((m, i) => monthRates(g, m.temperature, ti, pes[i], pis[i], dry).rate.some((r, k) => k > 0 && k < n && r > RATE_EPS));

  // the start month: the first month that condenses after one that does not (ISO 13788:2012 7.3,
  // from memory); of several such, the start of the longest run of condensing months
  let start: number | null = null;
  if (condensesDry.some(Boolean)) {
    if (condensesDry.every(Boolean)) start = 0;
    else {
      let bestLength = -1;
      for (let i = 0; i < 12; i++) {
        if (!condensesDry[i] || condensesDry[(i + 11) % 12]) continue;
        let length = 0;
        while (length < 12 && condensesDry[(i + length) % 12]) length++;
        if (length > bestLength) {
          bestLength = length;
          start = i;
        }
      }
    }
  }

  const months = new Array<GlaserMonth>(12);
  const held = new Array<number>(n + 1).fill(0);
  let maxAccumulated = 0;
  let maxAt: GlaserYear['maxAt'] = null;
  let maxPlane = 0;
  const order = start === null ? [...Array(12).keys()] : [...Array(12).keys()].map((i) => (start + i) % 12);
  for (const i of order) {
    const m = climate.months[i];
    const seconds = DAYS_IN_MONTH[i] * SECONDS_PER_DAY;
    const wet = held.map((h) => h > 0);
    const r = monthRates(g, m.temperature, ti, pes[i], pis[i], start === null ? dry : wet);
    const planes: PlaneState[] = [];
    const condensationPlanes: number[] = [];
    let condensed = 0;
    let evaporated = 0;
    for (let k = 0; k <= n; k++) {
      let rate = k > 0 && k < n ? r.rate[k] : 0;
      if (Math.abs(rate) < RATE_EPS) rate = 0;
      let c = 0;
      let e = 0;
      if (start !== null && rate > 0) {
        c = rate * seconds * 1000;
        held[k] += c;
      } else if (start !== null && rate < 0 && held[k] > 0) {
        e = Math.min(held[k], -rate * seconds * 1000);
        held[k] -= e;
        if (held[k] < 1e-12) held[k] = 0;
      }
      if (rate > 0 || (k === 0 && r.surfaceCondenses[0]) || (k === n && r.surfaceCondenses[1])) condensationPlanes.push(k);
      condensed += c;
      evaporated += e;
      if (held[k] > maxPlane) {
        maxPlane = held[k];
        maxAt = { month: i + 1, plane: k };
      }
      planes.push({ sd: g.sd[k], x: g.x[k], temperature: r.temperature[k], saturation: r.saturation[k], vapour: r.vapour[k], rate, condensed: c, evaporated: e, accumulated: held[k] });
    }
    const accumulated = held.reduce((a, b) => a + b, 0);
    maxAccumulated = Math.max(maxAccumulated, accumulated);
    months[i] = {
      month: i + 1,
      outsideTemperature: m.temperature,
      outsideRelativeHumidity: m.relativeHumidity,
      insideTemperature: ti,
      outsideVapourPressure: pes[i],
      insideVapourPressure: pis[i],
      planes,
      condensationPlanes,
      condensed,
      evaporated,
      accumulated,
    };
  }
  return {
    months,
    startMonth: start === null ? null : start + 1,
    maxAccumulated,
    maxAt,
    driesOut: held.every((h) => h === 0),
    condenses: start !== null,
    sd: g.sd,
    x: g.x,
  };
}
