/**
 * Outgoing e-mail through nodemailer over SMTP (config.smtp). In development and tests the SMTP
 * server is the local catcher (mail-catcher.ts); in production it is the shop's own relay.
 * Every message has a plain-text and an HTML part.
 */
import nodemailer, { type Transporter } from 'nodemailer';
import { loadConfig, type AppConfig } from '../config';

/** One message to send. */
export interface OutgoingMail {
  readonly to: string;
  readonly subject: string;
  readonly text: string;
  readonly html: string;
}

interface MailState {
  readonly config: AppConfig;
  readonly transport: Transporter;
}

let state: MailState | null = null;

/** Uses `config` for every message from now on (called once by createApp). */
export function configureMail(config: AppConfig): void {
  if (state?.config === config) return;
  state?.transport.close();
  state = {
    config,
    transport: nodemailer.createTransport({
      host: config.smtp.host,
      port: config.smtp.port,
      secure: config.smtp.secure,
      auth: config.smtp.user ? { user: config.smtp.user, pass: config.smtp.password ?? '' } : undefined,
      // The local catcher speaks plain SMTP on loopback; a real relay may offer STARTTLS.
      ignoreTLS: config.mailFake,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 20_000,
    }),
  };
}

/** The configuration mail is sent with (the environment's when createApp has not run). */
export function mailConfig(): AppConfig {
  if (!state) configureMail(loadConfig());
  return state!.config;
}

/** A link into the app: config.publicUrl + path. */
export function appLink(path: string): string {
  return mailConfig().publicUrl.replace(/\/+$/, '') + path;
}

/**
 * Sends one message. Resolves true when the SMTP server accepted it; a failure is logged and
 * resolves false, so a mail outage never breaks the request that caused the message.
 */
export async function sendMail(mail: OutgoingMail): Promise<boolean> {
  const config = mailConfig();
  try {
    await state!.transport.sendMail({ from: config.smtp.from, to: mail.to, subject: mail.subject, text: mail.text, html: mail.html });
    return true;
  } catch (err) {
    console.error(`[mail] could not send "${mail.subject}" to ${mail.to}:`, err instanceof Error ? err.message : err);
    return false;
  }
}

/** Escapes text for an HTML part. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}
