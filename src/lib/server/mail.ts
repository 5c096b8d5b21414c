import nodemailer from 'nodemailer';
import { SMTP_URL, MAIL_FROM } from 'astro:env/server';
import { db } from './db';
import { outboundMail } from './db/schema';

const transport = nodemailer.createTransport(SMTP_URL);

export interface Mail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** what the message is for, kept in the outbound log: verify, reset, invite... */
  purpose: string;
}

/** send one message over SMTP and log the attempt; throws when the server refuses it */
export async function sendMail(mail: Mail): Promise<void> {
  try {
    const info = await transport.sendMail({ from: MAIL_FROM, to: mail.to, subject: mail.subject, text: mail.text, html: mail.html });
    await db.insert(outboundMail).values({
      toAddress: mail.to,
      subject: mail.subject,
      purpose: mail.purpose,
      status: 'sent',
      messageId: info.messageId ?? null,
    });
  } catch (err) {
    await db.insert(outboundMail).values({
      toAddress: mail.to,
      subject: mail.subject,
      purpose: mail.purpose,
      status: 'failed',
      error: err instanceof Error ? err.message : String(err),
    });
    throw err;
  }
}
