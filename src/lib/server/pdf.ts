// the Report as a PDF: Debian's Chromium, headless through playwright-core, prints the report
// page as the person asking sees it (their session cookie goes with the page's request). one
// browser is started on the first PDF and kept; one PDF is printed at a time; an issued
// revision never changes, so its PDF is printed once and kept in memory.
import { chromium, type Browser } from 'playwright-core';

const CHROMIUM = '/usr/bin/chromium';
/** the flags tests/support/browser.ts uses on this machine */
const ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];
const CACHE_LIMIT = 32;
/** ms a print may take before it is given up */
const PRINT_TIMEOUT = 30_000;

let browser: Promise<Browser> | null = null;
let queue: Promise<unknown> = Promise.resolve();
const cache = new Map<string, Uint8Array>();

function started(): Promise<Browser> {
  if (!browser) {
    browser = chromium.launch({ executablePath: CHROMIUM, headless: true, args: ARGS }).then((b) => {
      b.on('disconnected', () => (browser = null));
      return b;
    });
    browser.catch(() => (browser = null));
  }
  return browser;
}

async function print(url: string, cookie: string | null): Promise<Uint8Array> {
  const b = await started();
  const context = await b.newContext({ extraHTTPHeaders: cookie ? { cookie } : {} });
  try {
    const page = await context.newPage();
    const res = await page.goto(url, { waitUntil: 'load', timeout: PRINT_TIMEOUT });
    if (!res || res.status() !== 200) throw new Error(`the report page answered ${res?.status() ?? 'nothing'}`);
    await page.emulateMedia({ media: 'print' });
    return await page.pdf({ format: 'A4', printBackground: true, margin: { top: '14mm', bottom: '14mm', left: '14mm', right: '14mm' } });
  } finally {
    await context.close();
  }
}

/**
 * the PDF of a report page; `cacheKey` (an issued revision) keeps it for the next asker.
 * prints run one after another so a burst of asks does not start many page loads at once.
 */
export function reportPdf(url: string, cookie: string | null, cacheKey: string | null): Promise<Uint8Array> {
  const hit = cacheKey ? cache.get(cacheKey) : undefined;
  if (hit) return Promise.resolve(hit);
  const job = queue.then(async () => {
    const again = cacheKey ? cache.get(cacheKey) : undefined;
    if (again) return again;
    const pdf = await print(url, cookie);
    if (cacheKey) {
      if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value!);
      cache.set(cacheKey, pdf);
    }
    return pdf;
  });
  queue = job.catch(() => undefined);
  return job;
}
