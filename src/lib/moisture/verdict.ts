// the moisture check in plain words: the verdict, the surface check and the method's limits.
// shared by the workbench, the report, the shared view and the history (no DOM, no framework).
import { MONTH_NAMES } from './climate.ts';
import type { MoistureAssessment } from './assess.ts';

/** the method's own limits, in our words (after ISO 13788:2012 clause 1 and 7.1, from memory) */
export const MOISTURE_CAUTIONS: readonly string[] = [
  'Steady state: each month is taken as one steady condition; daily swings, sun and night-time cooling of the outer face are left out.',
  'Vapour moves by diffusion only: no liquid water transport, no capillary redistribution and no moisture stored in the materials.',
  'No air leakage: warm moist air carried through gaps and joints can bring far more water than diffusion does.',
  'No driving rain, rising damp or moisture built in during construction; material values are typical, not measured.',
  'A screening method: it ranks build-ups and flags risks; it does not predict the real moisture content of a wall.',
];

/** the sentence that goes wherever the verdict shows */
export const MOISTURE_DEFERRAL = 'A hygrothermal specialist and local codes decide.';

/** the name of plane k (0 the outside surface, n the inside surface, between them an interface) */
export function planeName(layers: { name: string }[], k: number): string {
  if (k <= 0) return 'the outside surface';
  if (k >= layers.length) return 'the inside surface';
  return `${layers[k - 1].name} / ${layers[k].name}`;
}

/** g/m²: an amount held at an interface above which the trade is usually wary, even if it dries out (common practice, not a clause of ISO 13788) */
export const LARGE_AMOUNT = 500;

const grams = (v: number): string => (v >= 100 ? v.toFixed(0) : v >= 10 ? v.toFixed(1) : v.toFixed(2));

export interface MoistureVerdictText {
  kind: MoistureAssessment['verdict'];
  /** a short label: "No condensation", "Dries out within the year", "Accumulates: fails" */
  label: string;
  /** one or two sentences */
  text: string;
  /** the surface check in one sentence */
  surface: string;
  surfaceRisk: 'none' | 'mould' | 'condensation';
}

/** the interstitial and surface verdicts in plain words */
export function moistureVerdictText(a: MoistureAssessment): MoistureVerdictText {
  const g = a.glaser;
  let label: string;
  let text: string;
  const where = g.maxAt ? `at ${planeName(a.layers, g.maxAt.plane)}` : '';
  const when = g.maxAt ? `, at the end of ${MONTH_NAMES[g.maxAt.month - 1]}` : '';
  if (a.verdict === 'none') {
    label = 'No condensation';
    text = 'No interstitial condensation in any month of the year by the ISO 13788 monthly method.';
  } else if (a.verdict === 'driesOut') {
    label = 'Condenses, dries out within the year';
    text = `Vapour condenses in the cold months and dries out within the year: at most ${grams(g.maxAccumulated)} g/m² is held, ${where}${when}.`;
    if (g.maxAccumulated > LARGE_AMOUNT) {
      text += ` That is more than the ${LARGE_AMOUNT} g/m² often taken as the most an interface may hold even when it dries out (common practice; the limit depends on the materials and on local codes).`;
    }
  } else {
    const left = g.months[(((g.startMonth ?? 1) + 10) % 12)].accumulated;
    label = 'Accumulates: fails';
    text = `Vapour condenses faster than it can dry out: ${grams(left)} g/m² is still held at the end of the year (${where}), so water builds up year on year. The build-up fails the ISO 13788 check.`;
  }
  const s = a.surface;
  let surface: string;
  let surfaceRisk: MoistureVerdictText['surfaceRisk'] = 'none';
  if (s.fRsiMin === null || s.criticalMonth === null) {
    surface = `Inside surface: f_Rsi ${s.fRsi.toFixed(3)}; no month loses heat to the outside, so there is no surface check.`;
  } else {
    const month = MONTH_NAMES[s.criticalMonth - 1];
    if (s.condensationRisk) {
      surfaceRisk = 'condensation';
      surface = `Inside surface: f_Rsi ${s.fRsi.toFixed(3)} is below ${(s.fRsiMinCondensation ?? 0).toFixed(3)}, the least that keeps the surface above the dew point: water condenses on it, and mould is likely (needs ${s.fRsiMin.toFixed(3)} in ${month}).`;
    } else if (s.mouldRisk) {
      surfaceRisk = 'mould';
      surface = `Inside surface: f_Rsi ${s.fRsi.toFixed(3)} is below ${s.fRsiMin.toFixed(3)}, the least that keeps the surface humidity under 80 % in ${month} (the critical month): mould risk.`;
    } else {
      surface = `Inside surface: f_Rsi ${s.fRsi.toFixed(3)} meets ${s.fRsiMin.toFixed(3)}, the least that keeps the surface humidity under 80 % in ${month} (the critical month): no mould or surface condensation risk by this check.`;
    }
  }
  return { kind: a.verdict, label, text, surface, surfaceRisk };
}

/** the moisture figures a run keeps beside its thermal figures (plain data: cloned to and from the worker) */
export interface MoistureFigures {
  verdict: MoistureAssessment['verdict'];
  label: string;
  text: string;
  surfaceText: string;
  /** g/m² */
  maxAccumulated: number;
  /** the plane of the largest amount held, in words; null when nothing condenses */
  maxAtPlane: string | null;
  /** 1…12 */
  maxAtMonth: number | null;
  driesOut: boolean;
  startMonth: number | null;
  /** months in which vapour condenses */
  condensingMonths: number;
  fRsi: number;
  fRsiMin: number | null;
  fRsiMinCondensation: number | null;
  criticalMonth: number | null;
  mouldRisk: boolean;
  condensationRisk: boolean;
}

/** the figures of an assessment for a run's figures table and its kept summary */
export function moistureFigures(a: MoistureAssessment): MoistureFigures {
  const v = moistureVerdictText(a);
  const g = a.glaser;
  return {
    verdict: a.verdict,
    label: v.label,
    text: v.text,
    surfaceText: v.surface,
    maxAccumulated: g.maxAccumulated,
    maxAtPlane: g.maxAt ? planeName(a.layers, g.maxAt.plane) : null,
    maxAtMonth: g.maxAt?.month ?? null,
    driesOut: g.driesOut,
    startMonth: g.startMonth,
    condensingMonths: g.months.filter((m) => m.condensed > 0).length,
    fRsi: a.surface.fRsi,
    fRsiMin: a.surface.fRsiMin,
    fRsiMinCondensation: a.surface.fRsiMinCondensation,
    criticalMonth: a.surface.criticalMonth,
    mouldRisk: a.surface.mouldRisk,
    condensationRisk: a.surface.condensationRisk,
  };
}
