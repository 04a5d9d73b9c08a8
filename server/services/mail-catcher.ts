/**
 * The local SMTP catcher used in development and tests: an SMTP server on loopback that accepts
 * every message and stores it in MariaDB (captured_mails), where admins read it on the dev
 * mailbox page. Production sends through a real SMTP server instead (SMTP_* settings, MAIL_FAKE=false).
 */
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { AppConfig } from '../config';
import { createSequelize } from '../db';
import { CapturedMail, initModels } from '../models';

export interface RunningCatcher {
  readonly port: number;
  stop(): Promise<void>;
}

function addresses(value: AddressObject | AddressObject[] | undefined): string {
  const list = Array.isArray(value) ? value : value ? [value] : [];
  return list.flatMap((a) => a.value.map((v) => v.address ?? '')).filter(Boolean).join(', ');
}

export async function startMailCatcher({ config }: { config: AppConfig }): Promise<RunningCatcher> {
  const sequelize = createSequelize(config.db);
  initModels(sequelize);
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Slantwise local mail catcher',
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          await CapturedMail.create({
            sender: session.envelope.mailFrom ? session.envelope.mailFrom.address : addresses(mail.from),
            recipients: session.envelope.rcptTo.map((r) => r.address).join(', ') || addresses(mail.to),
            subject: (mail.subject ?? '(no subject)').slice(0, 500),
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
            receivedAt: new Date(),
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  server.on('error', (err) => console.error('[mail] catcher error:', err.message));
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(config.smtp.port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : config.smtp.port;
  return {
    port,
    async stop() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await sequelize.close();
    },
  };
}
