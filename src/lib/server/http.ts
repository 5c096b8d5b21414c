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

/** the deepest nesting of arrays and objects a JSON body may have; the workbench document needs 6 */
export const MAX_JSON_DEPTH = 32;

/** the nesting depth of a JSON text, counted without parsing it (brackets inside strings skipped) */
export function jsonDepth(text: string, stopAt = Infinity): number {
  let depth = 0;
  let deepest = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 92 /* \\ */) i++;
      else if (c === 34 /* " */) inString = false;
    } else if (c === 34) inString = true;
    else if (c === 123 || c === 91 /* { [ */) {
      depth++;
      if (depth > deepest) {
        deepest = depth;
        if (deepest > stopAt) return deepest;
      }
    } else if (c === 125 || c === 93 /* } ] */) depth--;
  }
  return deepest;
}

/** a body the server refused to read to its end (serve.mjs answers 413 before Astro sees it) */
async function bodyText(request: Request): Promise<string | null> {
  try {
    return await request.text();
  } catch {
    return null;
  }
}

/** parse a JSON body with a schema; the error is a ready 400/422 response */
export async function readJson<S extends z.ZodType>(request: Request, schema: S): Promise<{ data: z.infer<S> } | { response: Response }> {
  const text = await bodyText(request);
  if (text === null) return { response: apiError(400, 'bad_body', 'The request body could not be read.') };
  if (jsonDepth(text, MAX_JSON_DEPTH) > MAX_JSON_DEPTH) {
    return { response: apiError(400, 'too_deep', `The request body nests more than ${MAX_JSON_DEPTH} levels of arrays and objects.`) };
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    return { response: apiError(400, 'bad_json', 'The request body is not valid JSON.') };
  }
  let parsed: z.ZodSafeParseResult<z.infer<S>>;
  try {
    parsed = schema.safeParse(raw) as z.ZodSafeParseResult<z.infer<S>>;
  } catch {
    // a refinement that met a value of a shape it did not expect
    return { response: apiError(422, 'invalid', 'Some fields are not valid.') };
  }
  if (!parsed.success) {
    return { response: apiError(422, 'invalid', 'Some fields are not valid.', fieldErrors(parsed.error)) };
  }
  return { data: parsed.data };
}

/** the content types an HTML form sends */
export function isFormContentType(contentType: string | null): boolean {
  const type = (contentType ?? '').split(';')[0].trim().toLowerCase();
  return type === 'application/x-www-form-urlencoded' || type === 'multipart/form-data';
}

/** the content type of a JSON body */
export function isJsonContentType(contentType: string | null): boolean {
  const type = (contentType ?? '').split(';')[0].trim().toLowerCase();
  return type === 'application/json' || (type.startsWith('application/') && type.endsWith('+json'));
}

/** parse URL search params with a schema (values arrive as strings; use z.coerce) */
export function readQuery<S extends z.ZodType>(url: URL, schema: S): { data: z.infer<S> } | { response: Response } {
  const parsed = schema.safeParse(Object.fromEntries(url.searchParams));
  if (!parsed.success) {
    return { response: apiError(422, 'invalid', 'Some query parameters are not valid.', fieldErrors(parsed.error)) };
  }
  return { data: parsed.data };
}
