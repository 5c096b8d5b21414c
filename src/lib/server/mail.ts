// Outbound mail goes through the outbound_mail table as a queue. A request writes a row and
// answers at once, so its answer and its timing never depend on the mail server (nor tell
// whether an address has an account); the worker below, a timer loop in the app process,
// claims due rows with a lock (locked_until + lock_id, so several app instances never send one
// twice), sends them, and retries a failure after a growing wait until it gives up.
import nodemailer from 'nodemailer';
import { randomBytes } from 'node:crypto';
import { and, asc, eq, isNull, lt, lte, or } from 'drizzle-orm';
import { SMTP_URL, MAIL_FROM } from 'astro:env/server';
import { db } from './db';
import { outboundMail } from './db/schema';
import { shortReason } from './failures';

const transport = nodemailer.createTransport(SMTP_URL, { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 20_000 });

export interface Mail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** what the message is for, kept in the outbound log: verify, reset, invite... */
  purpose: string;
}

/** waits after the 1st, 2nd... failed attempt; after the last the message is marked failed */
export const RETRY_DELAYS_MS = [10_000, 60_000, 5 * 60_000, 30 * 60_000, 2 * 3600_000];
export const MAX_ATTEMPTS = RETRY_DELAYS_MS.length + 1;
/** how long a claimed message stays with the worker that claimed it */
const CLAIM_MS = 60_000;
const POLL_MS = 1000;
const BATCH = 10;

type Writer = Pick<typeof db, 'insert'>;

/**
 * Put a message in the queue; the worker sends it within about a second. With `forDeliverNow`
 * the worker leaves it alone (its first attempt is the caller's own, deliverNow).
 */
export async function queueMail(mail: Mail, opts: { writer?: Writer; forDeliverNow?: boolean } = {}): Promise<number> {
  const nextAttemptAt = new Date(Date.now() + (opts.forDeliverNow ? 10 * CLAIM_MS : 0));
  const [row] = await (opts.writer ?? db)
    .insert(outboundMail)
    .values({ toAddress: mail.to, subject: mail.subject.slice(0, 255), purpose: mail.purpose, status: 'queued', textBody: mail.text, htmlBody: mail.html ?? null, nextAttemptAt })
    .$returningId();
  return row.id;
}

type Row = typeof outboundMail.$inferSelect;

/** one attempt at one claimed row; true when it went out */
async function attempt(row: Row, lockId: string, retry: boolean): Promise<boolean> {
  const mine = and(eq(outboundMail.id, row.id), eq(outboundMail.lockId, lockId));
  try {
    const info = await transport.sendMail({ from: MAIL_FROM, to: row.toAddress, subject: row.subject, text: row.textBody, html: row.htmlBody ?? undefined });
    await db
      .update(outboundMail)
      .set({ status: 'sent', sentAt: new Date(), messageId: info.messageId ?? null, attempts: row.attempts + 1, error: null, lockedUntil: null, lockId: null })
      .where(mine);
    return true;
  } catch (err) {
    const attempts = row.attempts + 1;
    const giveUp = !retry || attempts >= MAX_ATTEMPTS;
    const reason = (err instanceof Error ? err.message : String(err)).slice(0, 500);
    await db
      .update(outboundMail)
      .set({
        status: giveUp ? 'failed' : 'queued',
        attempts,
        error: reason,
        nextAttemptAt: new Date(Date.now() + (RETRY_DELAYS_MS[attempts - 1] ?? 0)),
        lockedUntil: null,
        lockId: null,
      })
      .where(mine);
    return false;
  }
}

/** claim up to `limit` due rows (or the one row `id`) for this worker */
async function claim(limit: number, id?: number): Promise<{ rows: Row[]; lockId: string }> {
  const lockId = randomBytes(12).toString('hex');
  const now = new Date();
  await db
    .update(outboundMail)
    .set({ lockId, lockedUntil: new Date(now.getTime() + CLAIM_MS) })
    .where(
      and(
        id === undefined ? lte(outboundMail.nextAttemptAt, now) : eq(outboundMail.id, id),
        eq(outboundMail.status, 'queued'),
        or(isNull(outboundMail.lockedUntil), lt(outboundMail.lockedUntil, now)),
      ),
    )
    .orderBy(asc(outboundMail.id))
    .limit(limit);
  const rows = await db.select().from(outboundMail).where(eq(outboundMail.lockId, lockId));
  return { rows, lockId };
}

/**
 * Send a queued message now, once, and say whether it went out: for the answers that must
 * say so (an invitation an admin sends, a link a signed-in person asks again for). A failure
 * marks it failed; the caller tells the person to try again.
 */
export async function deliverNow(id: number): Promise<boolean> {
  const { rows, lockId } = await claim(1, id);
  if (!rows[0]) return false;
  return attempt(rows[0], lockId, false);
}

/** one pass of the worker: every due message, in order */
export async function sendDueMail(): Promise<number> {
  let sent = 0;
  for (;;) {
    const { rows, lockId } = await claim(BATCH);
    for (const row of rows) if (await attempt(row, lockId, true)) sent++;
    if (rows.length < BATCH) return sent;
  }
}

let started = false;
let lastProblem = '';

/** start the worker once per process; it never keeps the process alive on its own */
export function startMailWorker(): void {
  if (started) return;
  started = true;
  let busy = false;
  const timer = setInterval(async () => {
    if (busy) return;
    busy = true;
    try {
      await sendDueMail();
      lastProblem = '';
    } catch (err) {
      // the database is away: say so once, then keep trying quietly
      const reason = shortReason(err);
      if (reason !== lastProblem) console.error(`[wallpulse] mail queue: ${reason}`);
      lastProblem = reason;
    } finally {
      busy = false;
    }
  }, POLL_MS);
  timer.unref();
}
