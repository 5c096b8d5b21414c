// the verdicts a run's figures lead to, in words: the ISO 13788 moisture check, the periodic
// state (only for a repeating outdoor day) or the start-up memory of an upload, and the
// discretisation estimate. the Report and the Shared view
// show them beside the figures.
import type { RunDone } from './runDocument.ts';
import type { Exposure } from '../schemas/workbench.ts';
import { ACCURACY_TOLERANCE } from './figures.ts';
import { MOISTURE_DEFERRAL } from '../moisture/index.ts';
import { fixed } from './figureDefs.ts';

export interface Verdict {
  key: 'moisture' | 'surface' | 'periodic' | 'startup' | 'accuracy';
  title: string;
  text: string;
  tone: 'ok' | 'warn' | 'bad';
}

const STATE_TEXT: Record<string, string> = { draft: 'draft', in_check: 'in check', checked: 'checked', sent_back: 'sent back', issued: 'issued' };
/** a revision state in words */
export const stateTextOf = (state: string) => STATE_TEXT[state] ?? state.replace(/_/g, ' ');

/** a repeating outdoor day (sine or sol-air), so the periodic-state check means something */
export const repeatsDaily = (e: Exposure) => e.outdoor.mode !== 'series';

const pct = (v: number) => `${fixed(v * 100, 2)} %`;

export function verdictsOf(run: RunDone, exposure: Exposure): Verdict[] {
  const f = run.figures;
  const out: Verdict[] = [];
  const m = f.moisture;
  if (m) {
    out.push({
      key: 'moisture',
      title: `Moisture (ISO 13788): ${m.label.toLowerCase()}`,
      text: `${m.text} ${MOISTURE_DEFERRAL}`,
      tone: m.verdict === 'accumulates' ? 'bad' : m.verdict === 'none' ? 'ok' : 'warn',
    });
    out.push({
      key: 'surface',
      title: m.mouldRisk || m.condensationRisk ? 'Inside surface: mould or condensation risk' : 'Inside surface: clear of the mould limit',
      text: m.surfaceText,
      tone: m.condensationRisk ? 'bad' : m.mouldRisk ? 'warn' : 'ok',
    });
  }
  if (repeatsDaily(exposure) && f.periodic.start === 'periodic' && f.periodic.checked) {
    out.push(
      f.periodic.reached
        ? { key: 'periodic', title: 'Periodic state: reached (the run started in it)', text: `The run started in the periodic state of its repeating day; the inside heat flux at the same time of the last two reported days differs by at most ${pct(f.periodic.maxDifference)} of its amplitude (criterion ${pct(ACCURACY_TOLERANCE)}).`, tone: 'ok' }
        : { key: 'periodic', title: 'Periodic state: not held', text: `The inside heat flux at the same time of the last two reported days differs by up to ${pct(f.periodic.maxDifference)} of its amplitude (criterion ${pct(ACCURACY_TOLERANCE)}): refine the time step before reading the simulated decrement factor and time lag.`, tone: 'warn' },
    );
  }
  if (f.periodic.start === 'warm-up' && f.periodic.checked) {
    const forgotten = f.periodic.maxDifference <= ACCURACY_TOLERANCE;
    out.push({
      key: 'startup',
      title: forgotten ? 'Start-up: forgotten by the last reported day' : 'Start-up: still shows in the last reported day',
      text: `A second run from another start differs on the last reported day by up to ${pct(f.periodic.maxDifference)} of the inside heat flux amplitude (criterion ${pct(ACCURACY_TOLERANCE)})${forgotten ? '' : ': add warm-up days'}. An uploaded series does not repeat, so no periodic state is claimed, and the decrement factor and time lag are fitted and approximate.`,
      tone: forgotten ? 'ok' : 'warn',
    });
  }
  if (f.accuracy) {
    const fine = f.accuracy.relative <= ACCURACY_TOLERANCE;
    out.push({
      key: 'accuracy',
      title: fine ? 'Discretisation: fine enough' : 'Discretisation: too coarse',
      text: `The same run at twice the time step and twice the largest cell moves the inside heat flux by up to ${pct(f.accuracy.relative)} of its amplitude (criterion ${pct(ACCURACY_TOLERANCE)})${fine ? '' : ': use a shorter step or smaller cells'}.`,
      tone: fine ? 'ok' : 'warn',
    });
  }
  return out;
}
