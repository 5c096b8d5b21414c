// the material-class fills of the theme (global.css --color-mat-*) as colours, for the SVG strings
// of the moisture diagram that are drawn without the page's CSS (report, shared view)
import type { MaterialClass } from '../../../lib/schemas/workbench';

export const MAT_HEX: Record<MaterialClass, string> = {
  masonry: '#c98b6b',
  concrete: '#a9a8a2',
  timber: '#d9b77e',
  insulation: '#f1de8a',
  board: '#e6e0d3',
  metal: '#8e9aa6',
  membrane: '#5f6f7a',
  air: '#eef4f6',
  render: '#d8cfc0',
};

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
