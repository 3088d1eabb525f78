import type { MailMessage } from '../server/core/jobs';
import { unseal } from '../server/core/sealed';
import type { JobHandler } from './handlers';

/** Sends one mail. SMTP gives no idempotency key: at-least-once delivery may, rarely, send twice. */
export const sendMail: JobHandler<'mail.send'> = async (deps, data, jobId) => {
  const message = unseal<MailMessage>(deps.config.sessionSecret, data.sealed);
  const messageId = await deps.mailer.send(message);
  deps.logger.info({ event: 'mail_sent', jobId, purpose: data.purpose, messageId }, 'mail sent');
};
