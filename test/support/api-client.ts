import type { Express } from 'express';
import request from 'supertest';

/**
 * A browser-like API client for supertest: keeps cookies (session, XSRF-TOKEN) like a browser and,
 * like Angular's HttpClient, echoes the XSRF-TOKEN cookie in X-XSRF-TOKEN on mutating requests.
 */
export class ApiClient {
  readonly agent: ReturnType<typeof request.agent>;
  private xsrf: string | undefined;

  constructor(app: Express) {
    this.agent = request.agent(app);
  }

  /** The XSRF token last handed out by the server. */
  get xsrfToken(): string | undefined {
    return this.xsrf;
  }

  private remember(res: request.Response): request.Response {
    const cookies = ([] as string[]).concat((res.headers['set-cookie'] as unknown as string[] | undefined) ?? []);
    for (const cookie of cookies) {
      const match = /^XSRF-TOKEN=([^;]*)/.exec(cookie);
      if (match) this.xsrf = decodeURIComponent(match[1]!);
    }
    return res;
  }

  /** Makes sure the client holds an XSRF token, as the app's first GET does. */
  async prime(): Promise<void> {
    if (!this.xsrf) await this.get('/api/health');
  }

  async get(path: string): Promise<request.Response> {
    return this.remember(await this.agent.get(path));
  }

  async send(method: 'post' | 'put' | 'patch' | 'delete', path: string, body?: unknown, headers: Record<string, string> = {}): Promise<request.Response> {
    await this.prime();
    let req = this.agent[method](path).set('X-XSRF-TOKEN', this.xsrf ?? '');
    for (const [k, v] of Object.entries(headers)) req = req.set(k, v);
    return this.remember(await (body === undefined ? req : req.send(body as object)));
  }

  post(path: string, body?: unknown) {
    return this.send('post', path, body);
  }
  put(path: string, body?: unknown) {
    return this.send('put', path, body);
  }
  patch(path: string, body?: unknown) {
    return this.send('patch', path, body);
  }
  delete(path: string) {
    return this.send('delete', path);
  }

  /** A multipart upload like the browser's FormData: fields first, then each file as `files`. */
  async upload(path: string, files: { path: string; name?: string }[], fields: Record<string, string> = {}): Promise<request.Response> {
    await this.prime();
    let req = this.agent.post(path).set('X-XSRF-TOKEN', this.xsrf ?? '');
    for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
    for (const file of files) req = req.attach('files', file.path, file.name ? { filename: file.name } : undefined);
    return this.remember(await req);
  }

  async login(email: string, password: string): Promise<request.Response> {
    return this.post('/api/auth/login', { email, password });
  }
}
