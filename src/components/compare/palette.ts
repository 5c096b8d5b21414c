// one colour and one dash per alternative, from Wallpulse's own palette (src/styles/global.css);
// the dashes keep the lines apart in grey print
export const ALTERNATIVE_STYLE = [
  { cssVar: '--color-accent', fallback: '#21646a', dash: [] as number[], name: 'teal, solid' },
  { cssVar: '--color-t7', fallback: '#bf5038', dash: [7, 4], name: 'red, dashed' },
  { cssVar: '--color-t1', fallback: '#3f6ea8', dash: [2, 3], name: 'blue, dotted' },
  { cssVar: '--color-warn', fallback: '#8a5a00', dash: [9, 3, 2, 3], name: 'ochre, dash-dot' },
] as const;

/** the colour of alternative i as the page's theme defines it */
export function alternativeColour(i: number): string {
  const s = ALTERNATIVE_STYLE[i % ALTERNATIVE_STYLE.length];
  if (typeof document === 'undefined') return s.fallback;
  return getComputedStyle(document.documentElement).getPropertyValue(s.cssVar).trim() || s.fallback;
}

/** an SVG stroke-dasharray for alternative i */
export function alternativeDash(i: number): string | undefined {
  const d = ALTERNATIVE_STYLE[i % ALTERNATIVE_STYLE.length].dash;
  return d.length ? d.join(' ') : undefined;
}
