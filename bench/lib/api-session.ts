import { createReadStream, statSync } from 'node:fs';
import { request } from 'node:http';
import { randomBytes } from 'node:crypto';
import { basename } from 'node:path';

/**
 * A browser-like client for the real server over HTTP: keeps cookies, and echoes the XSRF-TOKEN
 * cookie in X-XSRF-TOKEN on every mutating request (the CSRF dance Angular's HttpClient does).
 */
export class ApiSession {
  private readonly cookies = new Map<string, string>();

  constructor(private readonly baseUrl: string) {}

  /** GET /api/health for the pre-session and XSRF-TOKEN cookies, then sign in. */
  async signIn(email: string, password: string): Promise<void> {
    await this.json('GET', '/api/health');
    await this.json('POST', '/api/auth/login', { email, password });
    if (!this.cookies.has('XSRF-TOKEN')) throw new Error('signed in, but the server handed out no XSRF-TOKEN cookie');
  }

  async json<T = unknown>(method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE', path: string, body?: unknown, expect?: number): Promise<T> {
    const response = await fetch(new URL(path, this.baseUrl), {
      method,
      headers: { ...this.headers(method), ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    this.remember(response.headers.getSetCookie());
    const text = await response.text();
    const ok = expect === undefined ? response.ok : response.status === expect;
    if (!ok) throw new Error(`${method} ${path}: HTTP ${response.status} ${text.slice(0, 500)}`);
    return (text ? JSON.parse(text) : undefined) as T;
  }

  /**
   * POST one file as multipart/form-data (part "files"), streamed from disk: the body is written
   * as the socket takes it, never held in memory. Resolves when the whole response has arrived.
   */
  uploadFile(path: string, file: string): Promise<{ status: number; body: unknown }> {
    const boundary = `----trenchwork-bench-${randomBytes(12).toString('hex')}`;
    const head = Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="files"; filename="${basename(file)}"\r\nContent-Type: video/mp4\r\n\r\n`,
    );
    const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
    const length = head.length + statSync(file).size + tail.length;
    const url = new URL(path, this.baseUrl);
    return new Promise((resolve, reject) => {
      const req = request(
        {
          host: url.hostname,
          port: url.port,
          path: url.pathname,
          method: 'POST',
          headers: { ...this.headers('POST'), 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': String(length) },
        },
        (res) => {
          const chunks: Buffer[] = [];
          res.on('data', (chunk: Buffer) => chunks.push(chunk));
          res.on('end', () => {
            this.remember(([] as string[]).concat(res.headers['set-cookie'] ?? []));
            const text = Buffer.concat(chunks).toString('utf8');
            let body: unknown = text;
            try {
              body = JSON.parse(text);
            } catch {
              // Left as text for the error message.
            }
            resolve({ status: res.statusCode ?? 0, body });
          });
          res.on('error', reject);
        },
      );
      req.on('error', reject);
      req.write(head);
      const stream = createReadStream(file);
      stream.on('error', (error) => req.destroy(error));
      stream.pipe(req, { end: false });
      stream.on('end', () => req.end(tail));
    });
  }

  /** The cookie and CSRF headers this session sends with `method`, for load generators (autocannon) that make their own requests. */
  headersFor(method: string): Record<string, string> {
    return this.headers(method);
  }

  private headers(method: string): Record<string, string> {
    const headers: Record<string, string> = {};
    if (this.cookies.size) headers.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    const xsrf = this.cookies.get('XSRF-TOKEN');
    if (method !== 'GET' && xsrf) headers['x-xsrf-token'] = decodeURIComponent(xsrf);
    return headers;
  }

  private remember(setCookies: readonly string[]): void {
    for (const line of setCookies) {
      const match = /^([^=;\s]+)=([^;]*)/.exec(line);
      if (!match) continue;
      // An expired or emptied cookie (sign-out) is dropped, as a browser would.
      if (match[2] === '' || /;\s*expires=Thu, 01 Jan 1970/i.test(line)) this.cookies.delete(match[1]!);
      else this.cookies.set(match[1]!, match[2]!);
    }
  }
}
