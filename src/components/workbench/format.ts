// numbers as the workbench shows them: fixed decimals so columns align, a dash for what is not known

export function fixed(v: number | null | undefined, decimals: number): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '–';
  return v.toLocaleString('en-GB', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
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
