// the whole moisture check of one build-up under one monthly climate, and the stable object the
// command line prints for a workbench document with a climate.
import type { Climate, IndoorClimate, MonthClimate } from './climate.ts';
import { glaserYear, type GlaserYear, type MoistureLayer } from './glaser.ts';
import { surfaceCheck, type SurfaceCheck } from './surface.ts';

export type MoistureVerdictKind = 'none' | 'driesOut' | 'accumulates';

export interface MoistureAssessment {
  layers: MoistureLayer[];
  climate: Climate;
  glaser: GlaserYear;
  surface: SurfaceCheck;
  /** none: no interstitial condensation; driesOut: condenses and dries out within the year; accumulates: fails */
  verdict: MoistureVerdictKind;
}

/** interstitial (clause 7) and surface (clause 6) checks of ISO 13788:2012 */
export function assessMoisture(layers: MoistureLayer[], climate: Climate, options: { rsi?: number; rse?: number } = {}): MoistureAssessment {
  const glaser = glaserYear(layers, climate, options);
  const surface = surfaceCheck(layers, climate);
  const verdict: MoistureVerdictKind = !glaser.condenses ? 'none' : glaser.driesOut ? 'driesOut' : 'accumulates';
  return { layers, climate, glaser, surface, verdict };
}

/** a layer of a workbench document, as far as the moisture check reads it (μ may be missing) */
export interface DocumentLayerLike {
  name: string;
  thickness: number;
  conductivity: number;
  vapourResistanceFactor: number | null;
}

/** the parts of a workbench document the moisture check reads */
export interface DocumentLike {
  layers: DocumentLayerLike[];
  exposure: { climate?: { months: MonthClimate[]; indoor: IndoorClimate } | null; heatFlowDirection?: HeatFlowDirection };
}

export type HeatFlowDirection = 'horizontal' | 'upward' | 'downward';

/** R_si of the interstitial check by the direction of heat flow, m²K/W: ISO 6946 conventional values (Table 7, from memory), as ISO 13788 4.3 refers to them */
export const INTERSTITIAL_RSI_BY_DIRECTION: Record<HeatFlowDirection, number> = { horizontal: 0.13, upward: 0.1, downward: 0.17 };

/** `path: message` lines for what keeps a document with a climate from the moisture check; empty when it can run */
export function moistureIssues(doc: DocumentLike): string[] {
  if (!doc.exposure.climate) return [];
  const issues: string[] = [];
  doc.layers.forEach((l, i) => {
    if (l.vapourResistanceFactor === null || !(l.vapourResistanceFactor >= 1)) {
      issues.push(`layers[${i}].vapourResistanceFactor: is needed for the moisture check (the document has a climate); give the layer's μ (at least 1)`);
    }
  });
  return issues;
}

/** the build-up as the moisture check reads it; null when a layer has no μ */
export function moistureLayers(layers: DocumentLayerLike[]): MoistureLayer[] | null {
  if (layers.some((l) => l.vapourResistanceFactor === null || !(l.vapourResistanceFactor >= 1))) return null;
  return layers.map((l) => ({ name: l.name, thickness: l.thickness, conductivity: l.conductivity, vapourResistanceFactor: l.vapourResistanceFactor as number }));
}

/** the moisture check of a document; null without a climate or when a layer lacks μ (see moistureIssues) */
export function assessDocument(doc: DocumentLike): MoistureAssessment | null {
  const climate = doc.exposure.climate;
  if (!climate || doc.layers.length === 0) return null;
  const layers = moistureLayers(doc.layers);
  if (!layers) return null;
  return assessMoisture(layers, { months: climate.months, indoor: climate.indoor }, { rsi: INTERSTITIAL_RSI_BY_DIRECTION[doc.exposure.heatFlowDirection ?? 'horizontal'] });
}

/** one month of the command line's `moisture` object */
export interface MoistureOutputMonth {
  month: number;
  /** °C */
  outsideTemperature: number;
  /** % */
  outsideRelativeHumidity: number;
  /** °C */
  insideTemperature: number;
  /** Pa */
  insideVapourPressure: number;
  /** j of the interface between layers j and j+1; −1 the outside surface, layers.length the inside surface */
  condensationInterfaces: number[];
  /** g/m² */
  condensed: number;
  evaporated: number;
  accumulated: number;
}

/** the command line's `moisture` object (masses g/m², pressures Pa, temperatures °C) */
export interface MoistureOutput {
  months: MoistureOutputMonth[];
  maxAccumulated: number;
  driesOut: boolean;
  surface: { fRsi: number; fRsiMin: number | null; criticalMonth: number | null; mouldRisk: boolean; condensationRisk: boolean };
}

/** plane k (0 the outside surface … n the inside surface) as the command line numbers it */
export function planeIndex(k: number, layerCount: number): number {
  return k === layerCount ? layerCount : k - 1;
}

/** the `moisture` object of an assessment */
export function moistureOutput(a: MoistureAssessment): MoistureOutput {
  const n = a.layers.length;
  return {
    months: a.glaser.months.map((m) => ({
      month: m.month,
      outsideTemperature: m.outsideTemperature,
      outsideRelativeHumidity: m.outsideRelativeHumidity,
      insideTemperature: m.insideTemperature,
      insideVapourPressure: m.insideVapourPressure,
      condensationInterfaces: m.condensationPlanes.map((k) => planeIndex(k, n)),
      condensed: m.condensed,
      evaporated: m.evaporated,
      accumulated: m.accumulated,
    })),
    maxAccumulated: a.glaser.maxAccumulated,
    driesOut: a.glaser.driesOut,
    surface: {
      fRsi: a.surface.fRsi,
      fRsiMin: a.surface.fRsiMin,
      criticalMonth: a.surface.criticalMonth,
      mouldRisk: a.surface.mouldRisk,
      condensationRisk: a.surface.condensationRisk,
    },
  };
}

/**
 * the command line's `moisture` object for a workbench document: null when the document has no
 * climate; throws with `path: message` lines (error.issues) when a layer lacks μ
 */
export function moistureFromDocument(doc: DocumentLike): MoistureOutput | null {
  if (!doc.exposure.climate) return null;
  const issues = moistureIssues(doc);
  if (issues.length > 0) throw new MoistureInputError(issues);
  const a = assessDocument(doc);
  return a ? moistureOutput(a) : null;
}

export class MoistureInputError extends Error {
  constructor(readonly issues: string[]) {
    super(issues.join('\n'));
    this.name = 'MoistureInputError';
  }
}
