// the material-class fills of the theme (global.css --color-mat-*) as colours, for SVG drawn
// without the page's CSS: the Report's charts, the Glaser diagrams, the PDF
import type { MaterialClass } from '../schemas/workbench.ts';

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
