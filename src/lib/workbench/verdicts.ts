// the verdicts a run's figures lead to, in words: the dew-point screening, the periodic state
// (only for a repeating outdoor day) and the energy balance. the Report and the Shared view
// show them beside the figures.
import type { RunDone } from './runDocument.ts';
import type { Exposure } from '../schemas/workbench.ts';
import { PERIODIC_TOLERANCE } from './figures.ts';
import { fixed } from './figureDefs.ts';

export interface Verdict {
  key: 'dewPoint' | 'periodic' | 'energy';
  title: string;
  text: string;
  tone: 'ok' | 'warn' | 'bad';
}

const STATE_TEXT: Record<string, string> = { draft: 'draft', in_check: 'in check', checked: 'checked', sent_back: 'sent back', issued: 'issued' };
/** a revision state in words */
export const stateTextOf = (state: string) => STATE_TEXT[state] ?? state.replace(/_/g, ' ');

/** a repeating outdoor day (sine or sol-air), so the periodic-state check means something */
export const repeatsDaily = (e: Exposure) => e.outdoor.mode !== 'series';

export function verdictsOf(run: RunDone, exposure: Exposure): Verdict[] {
  const f = run.figures;
  const out: Verdict[] = [];
  if (f.dewPoint) {
    const where = f.lowestInterface ? `the coldest interface (${f.lowestInterface.name}) reaches ${fixed(f.lowestInterface.value, 2)} °C` : `the inside surface reaches ${fixed(f.insideSurfaceMin.value, 2)} °C`;
    const dew = `the dew point of the indoor air is ${fixed(f.dewPoint.value, 2)} °C (${fixed(f.dewPoint.airTemperature, 1)} °C, ${fixed(f.dewPoint.relativeHumidity, 0)} % RH)`;
    out.push(
      f.belowDewPoint
        ? { key: 'dewPoint', title: 'Dew point: at risk', text: `At its coldest, ${where}; ${dew}. Indoor vapour reaching that interface would condense: assess the condensation risk properly (ISO 13788) before relying on this build-up.`, tone: 'bad' }
        : { key: 'dewPoint', title: 'Dew point: clear in this run', text: `At its coldest, ${where}; ${dew}. A screening check only.`, tone: 'ok' },
    );
  }
  if (repeatsDaily(exposure) && f.periodic.checked) {
    out.push(
      f.periodic.reached
        ? { key: 'periodic', title: 'Periodic state: reached', text: `The inside surface temperature at the same time of the last two days differs by at most ${fixed(f.periodic.maxDifference, 3)} K (criterion ${PERIODIC_TOLERANCE} K).`, tone: 'ok' }
        : { key: 'periodic', title: 'Periodic state: not reached', text: `The inside surface temperature at the same time of the last two days differs by up to ${fixed(f.periodic.maxDifference, 3)} K (criterion ${PERIODIC_TOLERANCE} K): add warm-up days before reading the simulated decrement factor and time lag.`, tone: 'warn' },
    );
  }
  if (Number.isFinite(f.energyBalanceError)) {
    out.push(
      f.energyBalanceError <= 1e-6
        ? { key: 'energy', title: 'Energy balance: closed', text: `Heat in, heat out and the change of stored heat agree to ${f.energyBalanceError.toExponential(1)} of the largest.`, tone: 'ok' }
        : { key: 'energy', title: 'Energy balance: open', text: `Heat in, heat out and the change of stored heat differ by ${f.energyBalanceError.toExponential(1)} of the largest: refine the time step or the mesh.`, tone: 'warn' },
    );
  }
  return out;
}
