// charts and tables leave the browser as files: a download link, a chart canvas with its title as PNG

export function download(name: string, href: string) {
  const a = document.createElement('a');
  a.href = href;
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
}

/** a canvas on white with a title, for a PNG of a chart */
export function withTitle(source: HTMLCanvasElement, title: string): string {
  const c = document.createElement('canvas');
  c.width = source.width;
  c.height = source.height + 28 * (window.devicePixelRatio || 1);
  const ctx = c.getContext('2d')!;
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, c.width, c.height);
  const dpr = window.devicePixelRatio || 1;
  ctx.fillStyle = '#23211d';
  ctx.font = `${600} ${14 * dpr}px "Source Sans 3", sans-serif`;
  ctx.fillText(title, 8 * dpr, 19 * dpr);
  ctx.drawImage(source, 0, 28 * dpr);
  return c.toDataURL('image/png');
}
