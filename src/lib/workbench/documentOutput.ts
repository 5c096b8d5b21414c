// what the command line's document mode prints for a workbench document: { model, result, figures }.
// one function builds it, so later parts (the moisture check) add their own object beside these.
import type { ModelData } from '../schemas/model.ts';
import type { Result } from '../thermal/types.ts';
import { monthlyOf, summaryOf } from './figures.ts';
import type { DocumentRun } from './runDocument.ts';

/** the figures table under stable camelCase names; units in the README ("Document mode: figures") */
export type DocumentFigures = Record<string, unknown>;

export interface DocumentOutput {
  model: ModelData;
  result: Result;
  figures: DocumentFigures;
  /** further objects that other checks add (e.g. `moisture`), each under its own key */
  [extra: string]: unknown;
}

/** the figures of a document run as the command line prints them */
export function documentFigures(run: DocumentRun): DocumentFigures {
  const f = run.figures;
  // the algebraic maximum of the inside flux stays in saved summaries for older runs; the table shows peak gain and loss
  const { peakInsideFluxWm2: _max, peakInsideFluxAt: _at, ...summary } = summaryOf(f);
  return {
    uValueWm2K: run.result.steady.uValue,
    totalResistanceM2KW: run.result.steady.totalResistance,
    ...summary,
    reportedDays: run.doc.exposure.days,
    warmupDays: run.reportStart / 86400,
    monthly: monthlyOf(f),
    notes: f.notes,
  };
}

/** the printed object: the model, the engine's whole result and the figures, plus any extra sections */
export function documentOutput(run: DocumentRun, extra: Record<string, unknown> = {}): DocumentOutput {
  return { model: run.model, result: run.result, figures: documentFigures(run), ...extra };
}
