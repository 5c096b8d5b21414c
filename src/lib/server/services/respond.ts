import type { APIContext } from 'astro';
import { apiError } from '../http';

/** a service failure as the one JSON error shape */
export function failure(f: { status: number; code: string; message: string; fields?: Record<string, string> }): Response {
  return apiError(f.status, f.code, f.message, f.fields);
}

/** a positive whole-number route parameter, or null (answered as 404 by the caller) */
export function idOf(value: string | undefined): number | null {
  if (!value || !/^\d{1,10}$/.test(value)) return null;
  const n = Number(value);
  return n > 0 ? n : null;
}

export const notFound = () => apiError(404, 'not_found', 'Not found.');

export function clientIp(ctx: Pick<APIContext, 'clientAddress'>): string {
  try {
    return ctx.clientAddress ?? '';
  } catch {
    return '';
  }
}

export const json = (body: unknown, status = 200) => Response.json(body, { status, headers: { 'cache-control': 'no-store' } });
