// command line: validate a model with the shared schema, run it, print one JSON result.
// exit 0 result on stdout; exit 2 invalid model (stdout empty, `path: message` lines on stderr);
// exit 1 anything else, one line on stderr.
import { readFileSync } from 'node:fs';
import { parseModel } from '../lib/schemas/model.ts';
import { simulate } from '../lib/thermal/index.ts';

class InvalidModel extends Error {
  constructor(readonly lines: string[]) {
    super(lines.join('\n'));
  }
}

const USAGE = 'usage: npm run --silent simulate -- <model.json | ->';

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

function run(argv: string[]): string {
  const args = argv.filter((a) => a !== '--');
  if (args.length !== 1) throw new Error(USAGE);
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
