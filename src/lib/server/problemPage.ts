// a page of its own for answers that come before or instead of the app's layout: the
// database is away (503), the request could not be read (400, 413, 415) or an error (500)
import { createHash } from 'node:crypto';
import { CSP_DIRECTIVES } from '../../stack/headers.mjs';

const STYLE =
  'body{font-family:system-ui,sans-serif;margin:0;background:#f6f4ef;color:#24211c}' +
  'main{max-width:34rem;margin:12vh auto;padding:2rem;background:#fff;border:1px solid #ddd6c8;border-radius:.5rem}' +
  'h1{font-size:1.4rem;margin:0 0 .75rem}p{line-height:1.5}a{color:#7a3d12}small{color:#6b655b}';
const STYLE_HASH = `'sha256-${createHash('sha256').update(STYLE).digest('base64')}'`;
const CSP = [...CSP_DIRECTIVES, "script-src 'none'", `style-src ${STYLE_HASH}`].join('; ');

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export function problemPage(status: number, title: string, paragraphs: string[], extraHeaders: Record<string, string> = {}): Response {
  const body = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${escape(title)} · Wallpulse</title><style>${STYLE}</style></head><body><main><h1>${escape(title)}</h1>${paragraphs.map((p) => `<p>${escape(p)}</p>`).join('')}<p><a href="/">Wallpulse home</a></p></main></body></html>`;
  return new Response(body, {
    status,
    headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store', 'content-security-policy': CSP, ...extraHeaders },
  });
}
