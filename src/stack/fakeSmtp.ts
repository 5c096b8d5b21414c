import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import type { Database } from '../lib/server/db/client';
import { smtpInbox } from '../lib/server/db/schema';
import { log } from './util';

/**
 * A local SMTP server for development and tests: it accepts every message on
 * loopback and keeps it in smtp_inbox, where the developer and the tests read it.
 */
export async function startFakeSmtp(db: Database, port: number): Promise<{ url: string; stop(): Promise<void> }> {
  const server = new SMTPServer({
    secure: false,
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Wallpulse local mail catcher',
    size: 5 * 1024 * 1024,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', async () => {
        try {
          const raw = Buffer.concat(chunks).toString('utf8');
          const parsed = await simpleParser(raw);
          await db.insert(smtpInbox).values({
            envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            envelopeTo: session.envelope.rcptTo.map((r) => r.address.toLowerCase()).join(','),
            subject: (parsed.subject ?? '').slice(0, 255),
            textBody: parsed.text ?? '',
            htmlBody: typeof parsed.html === 'string' ? parsed.html : null,
            raw,
          });
          callback();
        } catch (err) {
          callback(err as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  server.on('error', (err) => log(`fake SMTP: ${err.message}`));
  log(`fake SMTP listening on 127.0.0.1:${port} (messages land in the smtp_inbox table)`);
  return {
    url: `smtp://127.0.0.1:${port}`,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
