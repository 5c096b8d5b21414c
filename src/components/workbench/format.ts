// numbers as the workbench shows them: fixed decimals so columns align, a dash for what is not known

// toLocaleString builds a new formatter on every call (milliseconds per frame for a table); keep one per precision
const formatters = new Map<number, Intl.NumberFormat>();

export function fixed(v: number | null | undefined, decimals: number): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '–';
  let f = formatters.get(decimals);
  if (!f) {
    f = new Intl.NumberFormat('en-GB', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
    formatters.set(decimals, f);
  }
  return f.format(v);
}

/** a thickness in m shown in mm, with decimals only where they matter */
export function mm(thickness: number): string {
  const v = thickness * 1000;
  return fixed(v, v < 10 ? 1 : v % 1 === 0 ? 0 : 1);
}

/** seconds as hours with one decimal */
export function hours(seconds: number): string {
  return fixed(seconds / 3600, 1);
}
