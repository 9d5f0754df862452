import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { getEnv } from '../env';
import { logEvent } from '../log';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

const holder = globalThis as unknown as { __epicycleMailer?: Transporter };

function transporter(): Transporter {
  holder.__epicycleMailer ??= nodemailer.createTransport(getEnv().SMTP_URL);
  return holder.__epicycleMailer;
}

/** Sends one message over SMTP (the local catcher, or the provider in SMTP_URL). */
export async function sendMail(mail: OutgoingMail): Promise<void> {
  const info = await transporter().sendMail({ from: getEnv().MAIL_FROM, ...mail });
  logEvent('info', 'mail sent', { to: mail.to, subject: mail.subject, messageId: info.messageId });
}
