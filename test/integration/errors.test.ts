import { sql } from 'kysely';
import request from 'supertest';
import { ERROR_CODES } from '@shared/errors';
import type { ApiClient } from '../support/api-client';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * The one error shape {"error":{"code","message","fields"?,"requestId"}} for every failure (bad JSON,
 * unknown route, oversize body, validation, conflicts, unexpected errors) with no stack or SQL, plus
 * the health answer, the security headers and the OpenAPI document's completeness.
 */
const VERSION = (require('../../package.json') as { version: string }).version;

let t: TestApp;
let team: TeamFixture;
let admin: ApiClient;
const collected: { label: string; res: request.Response }[] = [];

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeamFixture(t.ctx.db, 'Errors');
  admin = t.client();
  expect((await admin.login(team.accounts.admin.email, TEST_PASSWORD)).status).toBe(200);
});
afterAll(async () => {
  await t?.close();
});

function keep(label: string, res: request.Response): request.Response {
  collected.push({ label, res });
  return res;
}

describe('error answers', () => {
  test('a malformed JSON body → 400 JSON error', async () => {
    const res = keep('bad json', await admin.send('post', '/api/auth/login', '{"email": "a@b.test", "password": ', { 'Content-Type': 'application/json' }));
    expect(res.status).toBe(400);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    expect(res.body).toStrictEqual({ error: { code: 'bad_request', message: 'The request body is not valid JSON.', requestId: expect.any(String) } });
  });

  test('an unknown /api route → 404 JSON error, for GET and for a verified POST', async () => {
    const get = keep('unknown get', await admin.get('/api/no-such-thing'));
    expect(get.status).toBe(404);
    expect(get.headers['content-type']).toMatch(/^application\/json/);
    expect(get.body).toStrictEqual({ error: { code: 'not_found', message: 'GET /api/no-such-thing was not found.', requestId: expect.any(String) } });
    const post = keep('unknown post', await admin.post(`/api/teams/${team.teamId}/no-such-thing`, {}));
    expect(post.status).toBe(404);
    expect(post.body.error.code).toBe('not_found');
  });

  test('an oversized body → 413 JSON error; a large body under the limit reaches validation', async () => {
    const huge = keep('oversize', await admin.post(`/api/teams/${team.teamId}/players/import`, { csv: 'x'.repeat(2.2 * 1024 * 1024) }));
    expect(huge.status).toBe(413);
    expect(huge.body).toStrictEqual({ error: { code: 'payload_too_large', message: 'The request body is too large.', requestId: expect.any(String) } });
    const large = keep('large csv', await admin.post(`/api/teams/${team.teamId}/players/import`, { csv: 'x'.repeat(1_100_000) }));
    expect(large.status).toBe(422);
    expect(large.body.error.fields).toEqual({ csv: 'The file is larger than 1 MB.' });
  });

  test('a bad path id → 400 naming the parameter', async () => {
    const res = keep('bad id', await admin.get('/api/teams/abc/players'));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_request');
    expect(Object.keys(res.body.error.fields)).toEqual(['teamId']);
  });

  test('the caller’s X-Request-Id is the error’s requestId (correlation with the logs)', async () => {
    const res = await request(t.app).get('/api/auth/me').set('X-Request-Id', 'trace-abc-123');
    expect(res.status).toBe(401);
    expect(res.body.error.requestId).toBe('trace-abc-123');
  });

  test('text with a NUL character is refused as bad input (422), not a 500', async () => {
    const res = keep('nul byte', await admin.post(`/api/teams/${team.teamId}/players`, { name: 'Nul\u0000Byte', jersey: 44, positions: ['LT'], classYear: 'Jr' }));
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    // When the answer names fields, the name must be among them.
    if (res.body.error.fields) expect(Object.keys(res.body.error.fields)).toContain('name');
    const stored = await t.ctx.db.selectFrom('players').select('id').where('team_id', '=', team.teamId).execute();
    expect(stored).toHaveLength(3);
  });

  test('an unexpected failure → 500 internal, with neither stack nor SQL', async () => {
    // Break this file's own database under the API: the repository's query fails.
    await sql`alter table seasons rename to seasons_gone`.execute(t.ctx.db);
    try {
      const res = keep('internal', await admin.get(`/api/teams/${team.teamId}`));
      expect(res.status).toBe(500);
      expect(res.body).toStrictEqual({ error: { code: 'internal', message: 'Something went wrong on our side. It has been logged.', requestId: expect.any(String) } });
      expect(res.text).not.toMatch(/seasons|relation|select/i);
    } finally {
      await sql`alter table seasons_gone rename to seasons`.execute(t.ctx.db);
    }
  });

  test('every error body collected above and a few more: error.code from the list, a message, no stack', async () => {
    keep('unauthenticated', await request(t.app).get('/api/auth/me'));
    keep('csrf', await request(t.app).post('/api/auth/logout'));
    const coach = t.client();
    await coach.login(team.accounts.coach.email, TEST_PASSWORD);
    keep('forbidden', await coach.get(`/api/teams/${team.teamId}/staff`));
    keep('validation', await admin.post(`/api/teams/${team.teamId}/players`, { name: '' }));
    keep('conflict', await admin.post(`/api/teams/${team.teamId}/players`, { name: 'Same Number', jersey: 70, positions: ['LT'], classYear: 'Jr' }));
    keep('csv rows', await admin.post(`/api/teams/${team.teamId}/players/import`, { csv: 'name,jersey,positions,class\nA,abc,LT,Jr' }));
    keep('bad credentials', await t.client().login(team.accounts.coach.email, 'wrong-password'));
    keep('token', await t.client().post('/api/auth/password-reset/confirm', { token: 'x'.repeat(43), password: 'long-enough-pass' }));

    expect(collected.length).toBeGreaterThanOrEqual(15);
    const problems: string[] = [];
    for (const { label, res } of collected) {
      const error = res.body?.error;
      if (res.status < 400) problems.push(`${label}: status ${res.status}`);
      if (!/^application\/json/.test(String(res.headers['content-type']))) problems.push(`${label}: content-type ${res.headers['content-type']}`);
      if (!error || !(ERROR_CODES as readonly string[]).includes(error.code)) problems.push(`${label}: code ${error?.code}`);
      if (typeof error?.message !== 'string' || error.message.length < 5) problems.push(`${label}: message ${error?.message}`);
      if (typeof error?.requestId !== 'string') problems.push(`${label}: no requestId`);
      const extra = Object.keys(error ?? {}).filter((k) => !['code', 'message', 'fields', 'requestId', 'rows'].includes(k));
      if (extra.length > 0) problems.push(`${label}: unexpected keys ${extra.join(',')}`);
      if (/"stack"|\bat .+\.(ts|js):\d+|node_modules/.test(res.text)) problems.push(`${label}: stack trace in body`);
      if (res.headers['cache-control'] !== 'no-store') problems.push(`${label}: cache-control ${res.headers['cache-control']}`);
    }
    expect(problems).toEqual([]);
  });
});

describe('health and headers', () => {
  test('GET /api/health → {"status":"ok","database":"ok",…}', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toStrictEqual({ status: 'ok', database: 'ok', uptimeSeconds: expect.any(Number), version: VERSION });
    expect(res.body.uptimeSeconds).toBeGreaterThanOrEqual(0);
  });

  test('API responses carry the security headers and no-store', async () => {
    const res = await admin.get('/api/auth/me');
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
    const csp = String(res.headers['content-security-policy']);
    expect(csp).toContain("frame-ancestors 'none'");
    // 'none' per SECURITY.md, or 'self' for Angular's <base href="/">: either stops a <base> pointing elsewhere.
    expect(csp).toMatch(/(^|;)\s*base-uri '(none|self)'\s*(;|$)/);
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("default-src 'self'");
  });
});

describe('the OpenAPI document', () => {
  interface Layer {
    route?: { path: string; methods: Record<string, boolean> };
    handle: { stack?: Layer[] };
    rawPath?: string;
  }

  /** Every route actually mounted under /api, read from Express's router (method + OpenAPI-style path). */
  function mountedRoutes(): string[] {
    const top = (t.app as unknown as { router: { stack: Layer[] } }).router.stack;
    const api = top.find((l) => l.handle.stack?.some((s) => s.route?.path === '/openapi.json'));
    expect(api).toBeDefined();
    const found: string[] = [];
    const walk = (stack: Layer[], prefix: string) => {
      for (const layer of stack) {
        if (layer.route) {
          for (const method of Object.keys(layer.route.methods)) found.push(`${method} ${prefix}${layer.route.path.replace(/:(\w+)/g, '{$1}')}`);
        } else if (layer.handle.stack) {
          walk(layer.handle.stack, prefix + (typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : ''));
        }
      }
    };
    walk(api!.handle.stack!, '/api');
    return found.filter((r) => r !== 'get /api/openapi.json').sort();
  }

  test('is OpenAPI 3.x and lists exactly the mounted routes, each with an operationId, access rule and responses', async () => {
    const res = await request(t.app).get('/api/openapi.json');
    expect(res.status).toBe(200);
    const doc = res.body as { openapi: string; info: { title: string; version: string }; paths: Record<string, Record<string, Record<string, unknown>>> };
    expect(doc.openapi).toMatch(/^3\.\d+\.\d+$/);
    expect(doc.info).toMatchObject({ title: 'Trenchwork API', version: VERSION });

    const documented = Object.entries(doc.paths)
      .flatMap(([path, methods]) => Object.keys(methods).map((m) => `${m} ${path}`))
      .sort();
    const mounted = mountedRoutes();
    expect(mounted.length).toBeGreaterThanOrEqual(21);
    expect(documented).toEqual(mounted);

    const ids = new Set<string>();
    for (const [path, methods] of Object.entries(doc.paths)) {
      for (const [method, op] of Object.entries(methods)) {
        expect({ route: `${method} ${path}`, hasId: typeof op.operationId === 'string' }).toEqual({ route: `${method} ${path}`, hasId: true });
        ids.add(op.operationId as string);
        expect(op['x-access']).toEqual(expect.objectContaining({ kind: expect.stringMatching(/^(public|signedIn|team)$/) }));
        expect(Object.keys(op.responses as object).length).toBeGreaterThan(0);
      }
    }
    expect(ids.size).toBe(documented.length);
  });
});
