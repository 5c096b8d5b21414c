// the moisture check ready for a printed or shared page: verdict, cautions, the diagrams of the
// month that matters most, and the table of months, all as plain strings and numbers (no DOM).
import { MONTH_NAMES } from './climate.ts';
import { assessDocument, type DocumentLike, type MoistureAssessment } from './assess.ts';
import { glaserDiagramSvg } from './diagram.ts';
import { MOISTURE_CAUTIONS, MOISTURE_DEFERRAL, moistureVerdictText, planeName, type MoistureVerdictText } from './verdict.ts';

export interface MoistureReportRow {
  month: string;
  /** °C */
  outsideTemperature: number;
  /** % */
  outsideRelativeHumidity: number;
  /** Pa */
  insideVapourPressure: number;
  /** g/m² */
  condensed: number;
  evaporated: number;
  accumulated: number;
  /** the planes where vapour condenses this month, else where water is held; '' for none */
  where: string;
  /** f_Rsi,min for mould; null in a month without heat loss */
  fRsiMin: number | null;
  surface: 'passes' | 'mould risk' | 'condensation' | 'no heat loss';
}

export interface MoistureReport {
  assessment: MoistureAssessment;
  verdict: MoistureVerdictText;
  cautions: readonly string[];
  deferral: string;
  /** 1…12: the month shown in the diagrams (most condensed, else the surface check's critical month, else January) */
  month: number;
  monthName: string;
  /** SVG documents: the section to scale and the same against s_d */
  diagrams: { thickness: string; sd: string };
  rows: MoistureReportRow[];
}

/** the month that tells most: the one condensing most, else the surface check's critical month */
export function keyMonth(a: MoistureAssessment): number {
  let best = 0;
  let month = a.surface.criticalMonth ?? 1;
  for (const m of a.glaser.months) {
    if (m.condensed > best) {
      best = m.condensed;
      month = m.month;
    }
  }
  return month;
}

/**
 * everything a page needs to show the moisture check of a document; null without a climate or when
 * a layer lacks μ (moistureIssues says which). layerFills: a CSS colour per layer for the diagrams.
 */
export function moistureReport(doc: DocumentLike, options: { layerFills?: string[]; month?: number; width?: number; height?: number } = {}): MoistureReport | null {
  const a = assessDocument(doc);
  if (!a) return null;
  const month = options.month ?? keyMonth(a);
  const size = { width: options.width ?? 640, height: options.height ?? 300, layerFills: options.layerFills };
  const rows = a.glaser.months.map((m): MoistureReportRow => {
    const s = a.surface.months[m.month - 1];
    const planes = m.condensationPlanes.length > 0 ? m.condensationPlanes : m.planes.map((p, k) => (p.accumulated > 0 ? k : -1)).filter((k) => k >= 0);
    return {
      month: MONTH_NAMES[m.month - 1],
      outsideTemperature: m.outsideTemperature,
      outsideRelativeHumidity: m.outsideRelativeHumidity,
      insideVapourPressure: m.insideVapourPressure,
      condensed: m.condensed,
      evaporated: m.evaporated,
      accumulated: m.accumulated,
      where: planes.map((k) => planeName(a.layers, k)).join('; '),
      fRsiMin: s.fRsiMinMould,
      surface: s.condensationRisk ? 'condensation' : s.mouldRisk ? 'mould risk' : s.fRsiMinMould === null ? 'no heat loss' : 'passes',
    };
  });
  return {
    assessment: a,
    verdict: moistureVerdictText(a),
    cautions: MOISTURE_CAUTIONS,
    deferral: MOISTURE_DEFERRAL,
    month,
    monthName: MONTH_NAMES[month - 1],
    diagrams: {
      thickness: glaserDiagramSvg(a, month, { ...size, axis: 'thickness' }),
      sd: glaserDiagramSvg(a, month, { ...size, axis: 'sd' }),
    },
    rows,
  };
}
