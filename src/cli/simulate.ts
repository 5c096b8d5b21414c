// command line: validate a model with the shared schema, run it, print one JSON result.
// `--document doc.json [--upload file.csv]` runs a saved workbench document the way the workbench
// does and prints { model, result, figures }.
// exit 0 result on stdout; exit 2 invalid model or document (stdout empty, `path: message` lines on
// stderr); exit 1 anything else, one line on stderr.
import { readFileSync } from 'node:fs';
import { parseModel } from '../lib/schemas/model.ts';
import { simulate } from '../lib/thermal/index.ts';
import { workbenchDocumentSchema, type UploadedSeries } from '../lib/schemas/workbench.ts';
import { guessMapping, parseCsv, validateCsv } from '../lib/workbench/csv.ts';
import { simulateDocument } from '../lib/workbench/runDocument.ts';
import { documentOutput } from '../lib/workbench/documentOutput.ts';
import { moistureFromDocument, moistureIssues } from '../lib/moisture/index.ts';

class InvalidModel extends Error {
  constructor(readonly lines: string[]) {
    super(lines.join('\n'));
  }
}

const USAGE = 'usage: npm run --silent simulate -- <model.json | -> | --document <doc.json | -> [--upload <file.csv | ->]';

function readInput(arg: string): string {
  try {
    return readFileSync(arg === '-' ? 0 : arg, 'utf8');
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    const why = err.code === 'ENOENT' ? 'no such file' : err.code === 'EISDIR' ? 'is a directory' : (err.code ?? err.message);
    throw new Error(`cannot read ${arg === '-' ? 'standard input' : arg}: ${why}`);
  }
}

// non-finite numbers would print as null; an infinite lumped biot (prescribed surface) is the one documented case
function toJson(result: unknown): string {
  let bad = '';
  const json = JSON.stringify(result, function (key, value) {
    if (typeof value === 'number' && !Number.isFinite(value)) {
      if (key === 'biot' && value === Infinity) return null;
      if (!bad) bad = key;
    }
    return value;
  });
  if (bad) throw new Error(`the result holds a non-finite number at "${bad}"`);
  return json;
}

/** the hourly series of a CSV file, read as the import screen reads it with its first guess of the columns */
function readUpload(arg: string): UploadedSeries {
  const csv = parseCsv(readInput(arg));
  const checked = validateCsv(csv, guessMapping(csv));
  if (!checked.ok || !checked.series) {
    const lines = checked.problems.map((p) => `upload: line ${p.line}: ${p.message}`);
    if (checked.moreProblems > 0) lines.push(`upload: ${checked.moreProblems} more problems`);
    throw new InvalidModel(lines.length > 0 ? lines : ['upload: the file holds no hourly series']);
  }
  return checked.series;
}

function runDocumentMode(docArg: string, uploadArg: string | null): string {
  if (docArg === '-' && uploadArg === '-') throw new Error('only one of --document and --upload can read standard input');
  let input: unknown;
  try {
    input = JSON.parse(readInput(docArg));
  } catch (e) {
    if (e instanceof SyntaxError) throw new InvalidModel([`document: not valid JSON (${e.message})`]);
    throw e;
  }
  // the document first, so a bad one is reported as such before the upload is asked for
  const parsed = workbenchDocumentSchema.safeParse(input);
  if (!parsed.success) throw new InvalidModel(parsed.error.issues.map((i) => `${formatDocPath(i.path)}: ${i.message}`));
  const out = parsed.data.exposure.outdoor;
  if (out.mode === 'series' && uploadArg === null) {
    throw new InvalidModel([`exposure.outdoor.uploadId: the outdoor air is an uploaded series (upload ${out.uploadId}); give its hourly CSV file with --upload <file.csv>`]);
  }
  if (out.mode !== 'series' && uploadArg !== null) {
    throw new InvalidModel([`exposure.outdoor.mode: is "${out.mode}", which takes no uploaded series; leave out --upload`]);
  }
  // a document with a climate needs every layer's μ for the moisture check
  const moistureProblems = moistureIssues(parsed.data);
  if (moistureProblems.length > 0) throw new InvalidModel(moistureProblems);
  const upload = uploadArg !== null ? readUpload(uploadArg) : null;
  const run = simulateDocument(parsed.data, upload);
  if (run.kind === 'invalid') throw new InvalidModel(run.issues);
  if (run.kind === 'cancelled') throw new Error('the run was cancelled');
  const moisture = moistureFromDocument(parsed.data);
  return toJson(documentOutput(run, moisture ? { moisture } : {}));
}

function formatDocPath(path: ReadonlyArray<PropertyKey>): string {
  const p = path.map((k) => (typeof k === 'number' ? `[${k}]` : `.${String(k)}`)).join('').replace(/^\./, '');
  return p === '' ? 'document' : p;
}

function run(argv: string[]): string {
  const args = argv.filter((a) => a !== '--');
  const docAt = args.indexOf('--document');
  if (docAt >= 0) {
    const uploadAt = args.indexOf('--upload');
    const docArg = args[docAt + 1];
    const uploadArg = uploadAt >= 0 ? args[uploadAt + 1] : null;
    const known = 2 + (uploadAt >= 0 ? 2 : 0);
    if (!docArg || docArg === '--upload' || (uploadAt >= 0 && (!uploadArg || uploadArg === '--document')) || args.length !== known) throw new Error(USAGE);
    return runDocumentMode(docArg, uploadArg);
  }
  if (args.length !== 1 || args[0].startsWith('--')) throw new Error(USAGE);
  const text = readInput(args[0]);
  let input: unknown;
  try {
    input = JSON.parse(text);
  } catch (e) {
    throw new InvalidModel([`model: not valid JSON (${(e as Error).message})`]);
  }
  const parsed = parseModel(input);
  if (!parsed.ok) throw new InvalidModel(parsed.issues);
  return toJson(simulate(parsed.model));
}

// a closed pipe (e.g. `| head`) is not an error of ours
process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
});

try {
  const json = run(process.argv.slice(2));
  process.stdout.write(json + '\n');
  process.exitCode = 0;
} catch (e) {
  if (e instanceof InvalidModel) {
    process.stderr.write(e.lines.join('\n') + '\n');
    process.exitCode = 2;
  } else {
    const message = e instanceof Error ? e.message : String(e);
    process.stderr.write(`simulate: ${message.split('\n')[0]}\n`);
    process.exitCode = 1;
  }
}
