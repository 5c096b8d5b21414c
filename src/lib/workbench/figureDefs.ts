// the one vocabulary of figures: every figure a run keeps (the keys of summaryOf, which are
// stable: saved runs, the CSV export and the command line's document mode use them) with the
// label, unit, decimals and how-it-is-computed text every screen shows. a key that is not
// listed is still shown in words, never as the program key.

/** how a value is written: fixed decimals, scientific, or text as kept */
export type FigureFormat = number | 'exp' | 'text';

export interface FigureDef {
  /** the stable key in a kept run's summary */
  key: string;
  label: string;
  /** '' for text figures and counts, '–' for dimensionless ratios */
  unit: string;
  format: FigureFormat;
  /** the tooltip: how the figure is computed */
  how: string;
  /** shown to a guest on the Shared view (the engine's housekeeping figures are not) */
  client: boolean;
  /** words for a kept value that is a code (a verdict kind, a month number) */
  text?: (value: number | string) => string;
}

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
const monthName = (v: number | string) => (typeof v === 'number' && v >= 1 && v <= 12 ? MONTHS[v - 1] : String(v));
const MOISTURE_VERDICTS: Record<string, string> = { none: 'no condensation', driesOut: 'condenses, dries out within the year', accumulates: 'accumulates: fails' };
const PERIODIC_STARTS: Record<string, string> = { periodic: 'periodic start (the repeating day from its own periodic state)', 'warm-up': 'warm-up days before the reported ones' };

const LAST_DAY = 'over the last simulated day';
const REPORTED = 'at the output times of the reported days (the warm-up days left out)';

/** the figures in the order every table shows them */
export const FIGURE_DEFS: readonly FigureDef[] = [
  {
    key: 'decrementFactorSimulated',
    label: 'Decrement factor, simulated',
    unit: '–',
    format: 3,
    how: `Amplitude of the first harmonic of the inside heat flux ${LAST_DAY}, divided by the amplitude of the first harmonic of the outdoor drive (sol-air temperature with sun, else the outdoor air) and by the U-value.`,
    client: true,
  },
  {
    key: 'decrementFactorAnalytic',
    label: 'Decrement factor, ISO 13786',
    unit: '–',
    format: 3,
    how: 'ISO 13786 transfer matrices for a 24 h period: |Y₁₂| / U.',
    client: true,
  },
  {
    key: 'timeLagSimulatedH',
    label: 'Time lag, simulated',
    unit: 'h',
    format: 2,
    how: `Phase of the first harmonic of the inside heat flux minus that of the outdoor drive, ${LAST_DAY}.`,
    client: true,
  },
  {
    key: 'timeLagAnalyticH',
    label: 'Time lag, ISO 13786',
    unit: 'h',
    format: 2,
    how: 'ISO 13786: the phase of the periodic thermal transmittance Y₁₂, in hours.',
    client: true,
  },
  {
    key: 'peakInsideFluxWm2',
    label: 'Peak inside heat flux',
    unit: 'W/m²',
    format: 2,
    how: `Largest inside heat flux (positive into the room) ${REPORTED}.`,
    client: true,
  },
  { key: 'peakInsideFluxAt', label: 'Peak inside heat flux, when', unit: '', format: 'text', how: 'The day and time of the peak inside heat flux, counted from the first reported day.', client: true },
  {
    key: 'heatGainedWhm2',
    label: 'Heat into the room, last day',
    unit: 'Wh/m²',
    format: 1,
    how: `Time integral of the positive part of the inside heat flux ${LAST_DAY} (trapezoids split where the flux changes sign).`,
    client: true,
  },
  {
    key: 'heatLostWhm2',
    label: 'Heat out of the room, last day',
    unit: 'Wh/m²',
    format: 1,
    how: `Time integral of the negative part of the inside heat flux ${LAST_DAY}, shown as a positive amount.`,
    client: true,
  },
  { key: 'insideSurfaceMinC', label: 'Inside surface, lowest', unit: '°C', format: 2, how: `Lowest inside surface temperature ${REPORTED}.`, client: true },
  { key: 'insideSurfaceMaxC', label: 'Inside surface, highest', unit: '°C', format: 2, how: `Highest inside surface temperature ${REPORTED}.`, client: true },
  {
    key: 'lowestInterfaceC',
    label: 'Lowest interface temperature',
    unit: '°C',
    format: 2,
    how: `Lowest temperature of any interface between two layers ${REPORTED}.`,
    client: true,
  },
  { key: 'lowestInterfaceAt', label: 'Lowest interface, where and when', unit: '', format: 'text', how: 'The two layers the coldest interface lies between, and the day and time.', client: true },
  {
    key: 'dewPointC',
    label: 'Dew point of the indoor air',
    unit: '°C',
    format: 2,
    how: 'Magnus formula (Alduchov & Eskridge coefficients, over water) at the mean indoor air temperature of the reported days and the indoor relative humidity.',
    client: true,
  },
  // peaks of gain and loss, totals over the whole run and the accuracy estimate (exposure v2)
  {
    key: 'periodicTransmittanceSimulatedWm2K',
    label: 'Periodic thermal transmittance, simulated',
    unit: 'W/m²K',
    format: 3,
    how: `Amplitude of the first harmonic of the inside heat flux per kelvin of amplitude of the outdoor drive, ${LAST_DAY}.`,
    client: true,
  },
  { key: 'periodicTransmittanceAnalyticWm2K', label: 'Periodic thermal transmittance, ISO 13786', unit: 'W/m²K', format: 3, how: 'ISO 13786 transfer matrices for a 24 h period: |Y₁₂|.', client: true },
  { key: 'peakHeatGainWm2', label: 'Peak heat gain', unit: 'W/m²', format: 2, how: `Largest inside heat flux into the room ${REPORTED}.`, client: true },
  { key: 'peakHeatGainAt', label: 'Peak heat gain, when', unit: '', format: 'text', how: 'The day and time of the peak heat gain.', client: true },
  { key: 'peakHeatLossWm2', label: 'Peak heat loss', unit: 'W/m²', format: 2, how: `Largest inside heat flux out of the room ${REPORTED}, shown as a positive amount.`, client: true },
  { key: 'peakHeatLossAt', label: 'Peak heat loss, when', unit: '', format: 'text', how: 'The day and time of the peak heat loss.', client: true },
  { key: 'totalHeatGainedKWhm2', label: 'Heat into the room, all reported days', unit: 'kWh/m²', format: 2, how: 'Time integral of the positive part of the inside heat flux over all reported days.', client: true },
  { key: 'totalHeatLostKWhm2', label: 'Heat out of the room, all reported days', unit: 'kWh/m²', format: 2, how: 'Time integral of the negative part of the inside heat flux over all reported days, shown as a positive amount.', client: true },
  {
    key: 'accuracyEstimatePercent',
    label: 'Accuracy estimate',
    unit: '%',
    format: 2,
    how: 'The run repeated with twice the time step and twice the cell size: the largest difference of the inside heat flux between the two, relative to its range (a step-doubling estimate of the discretisation error).',
    client: false,
  },
  { key: 'accuracyMaxDifferenceWm2', label: 'Accuracy estimate, largest flux difference', unit: 'W/m²', format: 3, how: 'The largest difference of the inside heat flux between this run and the one at twice the step and cell size.', client: false },
  // the ISO 13788 moisture check (under the document's monthly climate)
  {
    key: 'moistureVerdict',
    label: 'Interstitial condensation (ISO 13788)',
    unit: '',
    format: 'text',
    how: 'The ISO 13788 monthly Glaser method: vapour pressure against saturation pressure at each interface, condensate accumulated month by month over a year.',
    client: true,
    text: (v) => MOISTURE_VERDICTS[String(v)] ?? String(v),
  },
  { key: 'moistureMaxAccumulatedGm2', label: 'Most condensate held', unit: 'g/m²', format: 1, how: 'The largest amount of condensate held at any interface at the end of a month (ISO 13788 monthly method).', client: true },
  { key: 'moistureDriesOut', label: 'Condensate dries out within the year', unit: '', format: 'text', how: 'Whether all condensate has evaporated by the end of the twelve months (ISO 13788).', client: true },
  { key: 'moistureMaxAt', label: 'Most condensate, where', unit: '', format: 'text', how: 'The interface where the most condensate is held.', client: true },
  { key: 'moistureCondensingMonths', label: 'Months with condensation', unit: '', format: 0, how: 'The number of months in which vapour condenses at some interface (ISO 13788 monthly method).', client: true },
  { key: 'surfaceFRsi', label: 'Temperature factor of the inside surface', unit: '–', format: 3, how: 'f_Rsi = (θ_si − θ_e) / (θ_i − θ_e) of the build-up with the ISO 13788 surface resistances.', client: true },
  { key: 'surfaceFRsiMin', label: 'Lowest temperature factor allowed', unit: '–', format: 3, how: 'The f_Rsi the inside surface needs in the critical month to keep its relative humidity under 80 % (mould) by ISO 13788.', client: true },
  { key: 'surfaceCriticalMonth', label: 'Critical month for the inside surface', unit: '', format: 'text', how: 'The month that needs the highest temperature factor (ISO 13788).', client: true, text: monthName },
  { key: 'surfaceMouldRisk', label: 'Mould risk on the inside surface', unit: '', format: 'text', how: 'Whether the temperature factor of the build-up is below the lowest one allowed for mould (ISO 13788).', client: true },
  { key: 'surfaceCondensationRisk', label: 'Condensation on the inside surface', unit: '', format: 'text', how: 'Whether the inside surface falls to the dew point of the indoor air in some month (ISO 13788).', client: true },
  // how the run was made
  {
    key: 'energyBalanceError',
    label: 'Energy-balance error',
    unit: '–',
    format: 'exp',
    how: '|heat in at the outside − heat out at the inside − change of stored heat| over the whole run, relative to the largest of the three.',
    client: false,
  },
  {
    key: 'bookkeepingClosure',
    label: 'Energy bookkeeping closure',
    unit: '–',
    format: 'exp',
    how: 'Heat in at the outside − heat out at the inside − change of stored heat over the whole run, relative to the largest of the three; it closes by construction of the scheme, so it says nothing of accuracy.',
    client: false,
  },
  { key: 'scheme', label: 'Time stepping', unit: '', format: 'text', how: 'The time-stepping scheme as the engine ran it, with its number of steps.', client: false },
  { key: 'periodicStart', label: 'Start of the run', unit: '', format: 'text', how: 'A repeating day starts from its own periodic state; an uploaded series starts from warm-up days.', client: false, text: (v) => PERIODIC_STARTS[String(v)] ?? String(v) },
  { key: 'cells', label: 'Mesh cells', unit: '', format: 0, how: 'Each layer gets at least 4 cells and no cell thicker than the largest cell.', client: false },
  { key: 'timeStepS', label: 'Time step', unit: 's', format: 0, how: 'The time step of the Crank–Nicolson stepper, from the run settings.', client: false },
  { key: 'maxCellSizeMm', label: 'Largest cell', unit: 'mm', format: 1, how: 'The largest cell thickness allowed, from the run settings.', client: false },
  {
    key: 'periodicState',
    label: 'Periodic state',
    unit: '',
    format: 'text',
    how: 'Whether the inside surface temperature at the same time of the last two simulated days differs by at most 0.05 K; checked only for a repeating outdoor day.',
    client: false,
  },
  {
    key: 'periodicMaxDifferencePercent',
    label: 'Periodic state, largest day-to-day difference',
    unit: '%',
    format: 3,
    how: 'Largest difference of the inside heat flux at the same time of the last two simulated days, relative to its range.',
    client: false,
  },
  {
    key: 'periodicMaxDifferenceK',
    label: 'Periodic state, largest day-to-day difference',
    unit: 'K',
    format: 3,
    how: 'Largest difference of the inside surface temperature at the same time of the last two simulated days.',
    client: false,
  },
];

const BY_KEY = new Map(FIGURE_DEFS.map((d) => [d.key, d]));

/** the definition of a key, or null for a key no definition names */
export function figureDef(key: string): FigureDef | null {
  return BY_KEY.get(key) ?? null;
}

/** a key in words ("heatLostWhm2" → "heat lost whm2"): the last resort, so no screen shows a program key */
export function wordsOf(key: string): string {
  const words = key
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/[_-]+/g, ' ')
    .toLowerCase()
    .trim();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

export function labelOf(key: string): string {
  return BY_KEY.get(key)?.label ?? wordsOf(key);
}

/** fixed decimals with a real minus sign, '–' for no value */
export function fixed(v: number | null | undefined, digits: number): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '–';
  const s = v.toFixed(digits);
  return s.startsWith('-') ? `\u2212${s.slice(1)}` : s;
}

/** a kept value as its definition writes it */
export function formatFigure(key: string, value: unknown): string {
  if (value === null || value === undefined || value === '') return '–';
  const def = BY_KEY.get(key);
  if (def?.text && (typeof value === 'number' || typeof value === 'string')) return def.text(value);
  if (typeof value === 'number') {
    if (!def || def.format === 'text') return Math.abs(value) >= 100 ? fixed(value, 0) : fixed(value, 2);
    if (def.format === 'exp') return Number.isFinite(value) ? value.toExponential(1) : '–';
    return fixed(value, def.format);
  }
  return String(value);
}

export interface SummaryRow {
  key: string;
  label: string;
  value: string;
  unit: string;
  how: string;
}

/**
 * the rows of a kept run's summary, in the table's order (keys no definition names follow,
 * in words); `client` leaves out what a guest is not shown
 */
export function summaryRows(summary: Record<string, unknown> | null | undefined, opts: { client?: boolean } = {}): SummaryRow[] {
  if (!summary || typeof summary !== 'object') return [];
  const rows: SummaryRow[] = [];
  for (const d of FIGURE_DEFS) {
    if (!(d.key in summary)) continue;
    if (opts.client && !d.client) continue;
    const v = summary[d.key];
    if (v === null || v === undefined) continue;
    rows.push({ key: d.key, label: d.label, value: formatFigure(d.key, v), unit: d.unit, how: d.how });
  }
  if (!opts.client) {
    for (const [k, v] of Object.entries(summary)) {
      if (BY_KEY.has(k) || v === null || v === undefined || typeof v === 'object') continue;
      rows.push({ key: k, label: wordsOf(k), value: formatFigure(k, v), unit: '', how: 'A figure this version of Wallpulse has no description for.' });
    }
  }
  return rows;
}
