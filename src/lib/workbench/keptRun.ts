// a run kept with a revision, packed: a short header in the clear (what the run is, its
// figures and the length of every column) and the series as Float32 columns (time as
// Float64), zlib-compressed with fflate. the browser packs it, the server stores the bytes
// as they come (checking the header) and unpacks them for the Report and the Shared view;
// the workbench unpacks them to show the kept run again. pure: no DOM, no node.
import { unzlibSync, zlibSync } from 'fflate';
import type { RunDone, RunSeries } from './runDocument.ts';

/** bytes: the largest packed run the server keeps (README: "Kept runs") */
export const MAX_PACKED_BYTES = 5 * 1024 * 1024;
/** bytes: the largest series a packed run may unpack to (so a small file cannot unpack to a huge one) */
export const MAX_UNPACKED_BYTES = 96 * 1024 * 1024;

const MAGIC = [0x57, 0x50, 0x52, 0x31]; // "WPR1"

/** the columns in their packed order, with their element type */
const COLUMNS: [keyof RunSeries, 'f64' | 'f32'][] = [
  ['time', 'f64'],
  ['outsideAir', 'f32'],
  ['solAir', 'f32'],
  ['outsideSurface', 'f32'],
  ['insideSurface', 'f32'],
  ['insideAir', 'f32'],
  ['outsideFlux', 'f32'],
  ['insideFlux', 'f32'],
  ['interfaces', 'f32'],
  ['x', 'f64'],
  ['profiles', 'f32'],
];

/** what the header holds: the run without its series, and each column's length */
export interface PackedHeader {
  version: 1;
  lengths: Record<string, number>;
  run: Omit<RunDone, 'series'>;
}

// JSON has no NaN: write non-finite numbers as their names and read them back
const replacer = (_k: string, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? String(v) : v);
const reviver = (_k: string, v: unknown) => (v === 'NaN' || v === 'Infinity' || v === '-Infinity' ? Number(v) : v);

const bytesOf = (t: 'f64' | 'f32') => (t === 'f64' ? 8 : 4);

/** packs a finished run (series and figures) */
export function packRun(run: RunDone): Uint8Array {
  const { series, ...rest } = run;
  const lengths: Record<string, number> = {};
  let raw = 0;
  for (const [name, type] of COLUMNS) {
    lengths[name] = series[name].length;
    raw += series[name].length * bytesOf(type);
  }
  const header: PackedHeader = { version: 1, lengths, run: rest };
  const head = new TextEncoder().encode(JSON.stringify(header, replacer));
  const body = new Uint8Array(raw);
  let at = 0;
  for (const [name, type] of COLUMNS) {
    const col = type === 'f64' ? Float64Array.from(series[name]) : Float32Array.from(series[name]);
    body.set(new Uint8Array(col.buffer), at);
    at += col.byteLength;
  }
  const zipped = zlibSync(body, { level: 6 });
  const out = new Uint8Array(8 + head.length + zipped.length);
  out.set(MAGIC, 0);
  new DataView(out.buffer).setUint32(4, head.length, true);
  out.set(head, 8);
  out.set(zipped, 8 + head.length);
  return out;
}

/** reads the header of a packed run (cheap: nothing is unpacked); throws on anything else */
export function readPackedHeader(bytes: Uint8Array): { header: PackedHeader; bodyFrom: number; unpackedBytes: number } {
  if (bytes.length < 8 || MAGIC.some((m, i) => bytes[i] !== m)) throw new Error('not a packed run');
  const headLength = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength).getUint32(4, true);
  if (8 + headLength > bytes.length) throw new Error('the packed run is cut short');
  const header = JSON.parse(new TextDecoder().decode(bytes.subarray(8, 8 + headLength)), reviver) as PackedHeader;
  if (header?.version !== 1 || !header.lengths || !header.run) throw new Error('the packed run has no header');
  const { nTimes, nNodes, nInterfaces } = header.run;
  const expected: Record<string, number> = { time: nTimes, x: nNodes, interfaces: nTimes * nInterfaces, profiles: nTimes * nNodes };
  let unpackedBytes = 0;
  for (const [name, type] of COLUMNS) {
    const n = header.lengths[name];
    if (!Number.isInteger(n) || n < 0 || n !== (expected[name] ?? nTimes)) throw new Error(`the packed run's column ${name} has the wrong length`);
    unpackedBytes += n * bytesOf(type);
  }
  if (unpackedBytes > MAX_UNPACKED_BYTES) throw new Error('the packed run unpacks to more than the limit');
  return { header, bodyFrom: 8 + headLength, unpackedBytes };
}

/** unpacks a run packed by packRun (the columns come back as Float64Array) */
export function unpackRun(bytes: Uint8Array): RunDone {
  const { header, bodyFrom, unpackedBytes } = readPackedHeader(bytes);
  // unpack into a buffer one byte longer than the header promises: a longer body shows
  const body = unzlibSync(bytes.subarray(bodyFrom), { out: new Uint8Array(unpackedBytes + 1) });
  if (body.length !== unpackedBytes) throw new Error('the packed run does not match its header');
  const series = {} as RunSeries;
  let at = 0;
  for (const [name, type] of COLUMNS) {
    const n = header.lengths[name];
    const size = n * bytesOf(type);
    const slice = body.slice(at, at + size).buffer;
    series[name] = type === 'f64' ? new Float64Array(slice) : Float64Array.from(new Float32Array(slice));
    at += size;
  }
  return { ...header.run, series };
}

/** bytes to base64 and back, for the JSON body that keeps a run */
export function toBase64(bytes: Uint8Array): string {
  let s = '';
  for (let i = 0; i < bytes.length; i += 0x8000) s += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(s);
}

export function fromBase64(text: string): Uint8Array {
  const s = atob(text);
  const out = new Uint8Array(s.length);
  for (let i = 0; i < s.length; i++) out[i] = s.charCodeAt(i);
  return out;
}
