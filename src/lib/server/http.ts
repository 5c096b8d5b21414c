import type { z } from 'zod';

/** the one error shape of every API endpoint */
export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

export function apiError(status: number, code: string, message: string, fields?: Record<string, string>, extra?: Record<string, unknown>): Response {
  const body: ApiErrorBody & Record<string, unknown> = { error: { code, message, ...(fields ? { fields } : {}) }, ...extra };
  return Response.json(body, { status, headers: { 'cache-control': 'no-store' } });
}

/** zod issues as { "layers[1].thickness": "must be greater than 0 m" } */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.reduce<string>((acc, part) => (typeof part === 'number' ? `${acc}[${part}]` : acc ? `${acc}.${String(part)}` : String(part)), '');
    if (!(key in fields)) fields[key || '(body)'] = issue.message;
  }
  return fields;
}

/** parse a JSON body with a schema; the error is a ready 400/422 response */
export async function readJson<S extends z.ZodType>(request: Request, schema: S): Promise<{ data: z.infer<S> } | { response: Response }> {
  let raw: unknown;
  try {
    raw = await request.json();
  } catch {
    return { response: apiError(400, 'bad_json', 'The request body is not valid JSON.') };
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    return { response: apiError(422, 'invalid', 'Some fields are not valid.', fieldErrors(parsed.error)) };
  }
  return { data: parsed.data };
}

/** parse URL search params with a schema (values arrive as strings; use z.coerce) */
export function readQuery<S extends z.ZodType>(url: URL, schema: S): { data: z.infer<S> } | { response: Response } {
  const parsed = schema.safeParse(Object.fromEntries(url.searchParams));
  if (!parsed.success) {
    return { response: apiError(422, 'invalid', 'Some query parameters are not valid.', fieldErrors(parsed.error)) };
  }
  return { data: parsed.data };
}
