// Security headers on every response (serve.mjs sets them before Astro or the static file
// handler answers). Pages replace the Content-Security-Policy with Astro's own (the same
// directives plus the hashes of the page's inline scripts and styles; astro.config.mjs).

/** what the app loads: its own scripts, its own Web Worker, its bundled fonts and styles; nothing from elsewhere */
export const CSP_DIRECTIVES = [
  "default-src 'self'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "worker-src 'self' blob:",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
  "manifest-src 'self'",
];

/** the policy of responses that are not pages (static files, JSON, errors) */
export const BASE_CSP = [...CSP_DIRECTIVES, "script-src 'self'", "style-src 'self'"].join('; ');

/** the browser features the app never uses are switched off */
export const PERMISSIONS_POLICY = [
  'accelerometer=()',
  'autoplay=()',
  'camera=()',
  'display-capture=()',
  'encrypted-media=()',
  'geolocation=()',
  'gyroscope=()',
  'magnetometer=()',
  'microphone=()',
  'midi=()',
  'payment=()',
  'publickey-credentials-get=()',
  'serial=()',
  'usb=()',
  'xr-spatial-tracking=()',
].join(', ');

export const BASE_HEADERS = [
  ['content-security-policy', BASE_CSP],
  ['permissions-policy', PERMISSIONS_POLICY],
  ['x-content-type-options', 'nosniff'],
  ['referrer-policy', 'same-origin'],
  ['x-frame-options', 'DENY'],
  ['cross-origin-opener-policy', 'same-origin'],
];
