// small display helpers shared by the team, jobs and review islands

/** "12 Mar 2025, 14:05" in the reader's time zone; "—" for nothing */
export function formatWhen(value: string | Date | null | undefined): string {
  if (!value) return '—';
  const d = typeof value === 'string' ? new Date(value) : value;
  if (Number.isNaN(d.getTime())) return '—';
  return d.toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
}

export const STATE_LABEL: Record<string, string> = {
  draft: 'Draft',
  in_check: 'In check',
  checked: 'Checked',
  sent_back: 'Sent back',
  issued: 'Issued',
};

export const STATE_CLASS: Record<string, string> = {
  draft: 'bg-paper text-ink-soft border-line',
  in_check: 'bg-warn-soft text-warn border-warn/30',
  checked: 'bg-accent-soft text-accent-strong border-accent/30',
  sent_back: 'bg-danger-soft text-danger border-danger/30',
  issued: 'bg-ok/10 text-ok border-ok/30',
};

/** the error message of an API answer, with its field messages */
export async function errorOf(res: Response): Promise<{ message: string; fields: Record<string, string> }> {
  try {
    const body = (await res.json()) as { error?: { message?: string; fields?: Record<string, string> } };
    return { message: body.error?.message ?? `The server answered ${res.status}.`, fields: body.error?.fields ?? {} };
  } catch {
    return { message: `The server answered ${res.status}.`, fields: {} };
  }
}

/** JSON request to the app's API; cookies go along (same origin) */
export function send(method: string, url: string, body?: unknown): Promise<Response> {
  return fetch(url, {
    method,
    headers: body === undefined ? {} : { 'content-type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
}
