// the lightened layer fills of the moisture diagram, from the theme's material colours
import type { MaterialClass } from '../../../lib/schemas/workbench';
import { MAT_HEX } from '../../../lib/workbench/materialFills';

/** a colour mixed with white: share 0 keeps it, 1 gives white */
function lighten(hex: string, share: number): string {
  const n = parseInt(hex.slice(1), 16);
  const mix = (c: number) => Math.round(c + (255 - c) * share);
  const [r, g, b] = [mix((n >> 16) & 255), mix((n >> 8) & 255), mix(n & 255)];
  return `#${((1 << 24) | (r << 16) | (g << 8) | b).toString(16).slice(1)}`;
}

/** the fills of a build-up's layers, lightened so the lines over them read clearly */
export function layerFills(layers: { materialClass: MaterialClass }[]): string[] {
  return layers.map((l) => lighten(MAT_HEX[l.materialClass], 0.45));
}
