import type { Kysely } from 'kysely';
import type { AppContext } from '../core/context';
import type { MailMessage } from '../core/jobs';
import { seal } from '../core/sealed';

/** Queues a mail in the caller's transaction; the message is sealed so links never sit in the queue in clear. */
export function enqueueMail(app: AppContext, message: MailMessage, trx?: Kysely<any>): Promise<string | null> {
  return app.jobs.send('mail.send', { sealed: seal(app.config.sessionSecret, message), purpose: message.purpose }, trx);
}
