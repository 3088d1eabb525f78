/** Reads the mail the SMTP fake captured (its HTTP listing at DEV_MAILBOX_URL). */
export interface CapturedMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  date: string;
}

export async function listMail(): Promise<CapturedMail[]> {
  const base = process.env.DEV_MAILBOX_URL;
  if (!base) throw new Error('DEV_MAILBOX_URL is not set: run the tests with `npm test`.');
  const response = await fetch(`${base.replace(/\/$/, '')}/messages`);
  if (!response.ok) throw new Error(`The mailbox answered ${response.status}`);
  return ((await response.json()) as { messages: CapturedMail[] }).messages;
}

/** Waits until a mail to `to` (matching `subject` when given) arrives; newest first. */
export async function waitForMail(to: string, subject?: RegExp, timeoutMs = 15_000): Promise<CapturedMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await listMail()).find((m) => m.to.toLowerCase().includes(to.toLowerCase()) && (!subject || subject.test(m.subject)));
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`No mail to ${to} arrived within ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

/** The first link in a mail's text that points at `path` (e.g. '/join'). */
export function linkIn(mail: CapturedMail, path: string): string {
  const match = new RegExp(`https?://[^\\s]+${path.replace('/', '\\/')}[^\\s]*`).exec(mail.text);
  if (!match) throw new Error(`No ${path} link in mail "${mail.subject}"`);
  return match[0];
}
