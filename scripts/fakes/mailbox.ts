import { existsSync, readFileSync, renameSync, writeFileSync } from 'node:fs';

export interface CapturedMessage {
  readonly id: string;
  /** Envelope recipients (Bcc included), lower-cased, joined with ", ". */
  readonly to: string;
  readonly recipients: readonly string[];
  readonly from: string;
  readonly subject: string;
  readonly text: string;
  readonly html?: string;
  /** When the fake received it, ISO 8601. */
  readonly date: string;
  readonly attachments: readonly { filename: string; contentType: string; size: number }[];
}

/**
 * The SMTP fake's store: newest first, capped, and saved to a JSON file (write to a temporary
 * file, then rename) so restarting the stack keeps the mail.
 */
export class Mailbox {
  private messages: CapturedMessage[] = [];
  private saveTimer: NodeJS.Timeout | undefined;

  constructor(
    private readonly file: string | undefined,
    private readonly cap = 500,
  ) {
    if (file && existsSync(file)) {
      try {
        const saved = JSON.parse(readFileSync(file, 'utf8')) as { messages?: CapturedMessage[] };
        this.messages = Array.isArray(saved.messages) ? saved.messages.slice(0, cap) : [];
      } catch (error) {
        // A damaged file must not stop the stack; keep it aside for inspection.
        console.error(`mail store ${file} is unreadable (${(error as Error).message}); starting empty`);
        renameSync(file, `${file}.damaged-${Date.now()}`);
      }
    }
  }

  get size(): number {
    return this.messages.length;
  }

  add(message: CapturedMessage): void {
    this.messages.unshift(message);
    if (this.messages.length > this.cap) this.messages.length = this.cap;
    this.scheduleSave();
  }

  /** Newest first; `to` keeps messages with that recipient (case-insensitive). */
  list(filter: { to?: string; limit?: number } = {}): CapturedMessage[] {
    const to = filter.to?.trim().toLowerCase();
    const found = to ? this.messages.filter((m) => m.recipients.includes(to)) : this.messages;
    return filter.limit ? found.slice(0, filter.limit) : [...found];
  }

  clear(): number {
    const count = this.messages.length;
    this.messages = [];
    this.scheduleSave();
    return count;
  }

  /** Writes pending changes now (on shutdown). */
  flush(): void {
    if (this.saveTimer) clearTimeout(this.saveTimer);
    this.saveTimer = undefined;
    if (!this.file) return;
    const temporary = `${this.file}.tmp-${process.pid}`;
    writeFileSync(temporary, JSON.stringify({ messages: this.messages }));
    renameSync(temporary, this.file);
  }

  // Bursts of mail (a batch of invitations) are saved once, shortly after the last message.
  private scheduleSave(): void {
    if (!this.file || this.saveTimer) return;
    this.saveTimer = setTimeout(() => {
      try {
        this.flush();
      } catch (error) {
        console.error(`could not save ${this.file}: ${(error as Error).message}`);
      }
    }, 100);
  }
}
