// what changed between the document a run ran and the one on screen, in words a person
// can act on: the Response pane dims a run whose settings are not the current ones and
// names what changed.
import type { Exposure, WorkbenchDocument } from '../schemas/workbench.ts';
import { diffBuildUps } from './diff.ts';

const EXPOSURE_LABELS: [keyof Exposure, string][] = [
  ['outdoor', 'outdoor air'],
  ['indoor', 'indoor air'],
  ['heatFlowDirection', 'heat-flow direction'],
  ['insideSurfaceResistance', 'inside surface resistance'],
  ['outsideSurfaceResistance', 'outside surface resistance'],
  ['days', 'days to report'],
  ['warmupDays', 'warm-up days'],
  ['timeStep', 'time step'],
  ['maxCellSize', 'largest cell'],
  ['indoorRelativeHumidity', 'indoor relative humidity'],
];

/** JSON with sorted keys, so equal settings compare equal whatever their key order */
export function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(',')}]`;
  if (v && typeof v === 'object') {
    const o = v as Record<string, unknown>;
    return `{${Object.keys(o)
      .sort()
      .filter((k) => o[k] !== undefined)
      .map((k) => `${JSON.stringify(k)}:${canonical(o[k])}`)
      .join(',')}}`;
  }
  return JSON.stringify(v);
}

/** the exposure settings that differ, by their labels */
export function exposureChanges(ran: Exposure, now: Exposure): string[] {
  return EXPOSURE_LABELS.filter(([k]) => canonical(ran[k]) !== canonical(now[k])).map(([, label]) => label);
}

/** what changed since the run, one phrase each; empty when the run is of the current settings */
export function staleReasons(ran: WorkbenchDocument, now: WorkbenchDocument): string[] {
  if (ran === now) return [];
  const reasons: string[] = [];
  const d = diffBuildUps(ran, now);
  if (d.added.length) reasons.push(`layer added: ${d.added.join(', ')}`);
  if (d.removed.length) reasons.push(`layer removed: ${d.removed.join(', ')}`);
  for (const c of d.changed) reasons.push(`${c.name}: ${c.fields.join(', ')}`);
  if (d.reordered) reasons.push('layer order');
  reasons.push(...exposureChanges(ran.exposure, now.exposure));
  return reasons;
}
