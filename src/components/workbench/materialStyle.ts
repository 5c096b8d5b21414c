// the material-class fills of the theme (--color-mat-*) as whole class names, so Tailwind emits them
import type { MaterialClass } from '../../lib/schemas/workbench';

export const MAT_BG: Record<MaterialClass, string> = {
  masonry: 'bg-mat-masonry',
  concrete: 'bg-mat-concrete',
  timber: 'bg-mat-timber',
  insulation: 'bg-mat-insulation',
  board: 'bg-mat-board',
  metal: 'bg-mat-metal',
  membrane: 'bg-mat-membrane',
  air: 'bg-mat-air',
  render: 'bg-mat-render',
};

export const MAT_FILL: Record<MaterialClass, string> = {
  masonry: 'fill-mat-masonry',
  concrete: 'fill-mat-concrete',
  timber: 'fill-mat-timber',
  insulation: 'fill-mat-insulation',
  board: 'fill-mat-board',
  metal: 'fill-mat-metal',
  membrane: 'fill-mat-membrane',
  air: 'fill-mat-air',
  render: 'fill-mat-render',
};
