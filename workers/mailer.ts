import nodemailer from 'nodemailer';
import type { Config } from '../server/core/config';
import type { MailMessage } from '../server/core/jobs';

/** The SMTP transport: the local SMTP fake in development, the relay in SMTP_URL in production. */
export function createMailer(config: Config) {
  const transport = nodemailer.createTransport(config.smtpUrl);
  return {
    async send(message: MailMessage): Promise<string> {
      const info = await transport.sendMail({
        from: config.mailFrom,
        to: message.to,
        subject: message.subject,
        text: message.text,
        ...(message.html ? { html: message.html } : {}),
      });
      return info.messageId;
    },
    close: () => transport.close(),
  };
}
export type Mailer = ReturnType<typeof createMailer>;
