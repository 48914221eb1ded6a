import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/lib/env';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  headers?: Record<string, string>;
}

const globalForMail = globalThis as unknown as { kfMailer?: Transporter };

function transporter(): Transporter {
  globalForMail.kfMailer ??= nodemailer.createTransport(env().SMTP_URL, { from: env().MAIL_FROM });
  return globalForMail.kfMailer;
}

/** Sends one message through the configured SMTP relay (the local fake in development and tests). */
export async function sendMail(mail: OutgoingMail): Promise<void> {
  await transporter().sendMail({ from: env().MAIL_FROM, ...mail });
}
