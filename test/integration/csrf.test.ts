import request from 'supertest';
import { ApiClient } from '../support/api-client';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * CSRF: every state-changing route from the OpenAPI document × {no header, wrong token, token of
 * another session, cross-site Origin, Sec-Fetch-Site cross-site} → 403 csrf_rejected, with nothing
 * changed; the same request with the right token gets past the check. Plus the XSRF-TOKEN cookie and
 * the pre-session token that protects sign-in.
 */
interface Operation {
  operationId: string;
  method: 'post' | 'put' | 'patch' | 'delete';
  path: string;
}

function setCookies(res: request.Response): string[] {
  return ([] as string[]).concat((res.headers['set-cookie'] as unknown as string[] | undefined) ?? []);
}
function setCookieLine(res: request.Response, name: string): string | undefined {
  return setCookies(res).find((c) => c.startsWith(`${name}=`));
}
function cookieValue(res: request.Response, name: string): string | undefined {
  const line = setCookieLine(res, name);
  return line ? line.slice(name.length + 1).split(';')[0] : undefined;
}

let t: TestApp;
let team: TeamFixture;
let operations: Operation[];
let invitationId: number;
let coachMembershipId: number;
let admin: ApiClient;
let adminSession: string;
let adminXsrf: string;
let otherXsrf: string;

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeamFixture(t.ctx.db, 'Csrf');
  const invitation = await t.ctx.db
    .insertInto('invitations')
    .values({ team_id: team.teamId, email: 'pending@csrf.test', role: 'coach', token_hash: 'c'.repeat(64), invited_by: team.accounts.admin.userId, expires_at: new Date(Date.now() + 3_600_000) })
    .returning('id')
    .executeTakeFirstOrThrow();
  invitationId = invitation.id;
  coachMembershipId = (await t.ctx.db.selectFrom('memberships').select('id').where('user_id', '=', team.accounts.coach.userId).executeTakeFirstOrThrow()).id;

  admin = t.client();
  const login = await admin.login(team.accounts.admin.email, TEST_PASSWORD);
  expect(login.status).toBe(200);
  adminSession = cookieValue(login, 'tw.sid')!;
  adminXsrf = admin.xsrfToken!;
  expect(adminSession).toBeDefined();
  expect(adminXsrf).toBeDefined();

  // Another signed-in session whose (valid, for it) token is replayed against the admin's session.
  const other = t.client();
  expect((await other.login(team.accounts.coordinator.email, TEST_PASSWORD)).status).toBe(200);
  otherXsrf = other.xsrfToken!;
  expect(otherXsrf).not.toBe(adminXsrf);

  const doc = (await t.client().get('/api/openapi.json')).body as { paths: Record<string, Record<string, { operationId: string }>> };
  operations = Object.entries(doc.paths).flatMap(([path, methods]) =>
    Object.entries(methods)
      .filter(([method]) => method !== 'get' && method !== 'head' && method !== 'options')
      .map(([method, op]) => ({ operationId: op.operationId, method: method as Operation['method'], path })),
  );
  // Sign-out ends the admin's session: its control request runs last.
  operations.sort((a, b) => Number(a.operationId === 'logout') - Number(b.operationId === 'logout'));
});

afterAll(async () => {
  await t?.close();
});

function concretePath(path: string): string {
  const values: Record<string, string> = {
    teamId: String(team.teamId),
    playerId: String(team.playerIds[0]),
    invitationId: String(invitationId),
    membershipId: String(coachMembershipId),
    token: 'not-a-real-token-0123456789',
  };
  // Any other id: CSRF is checked before the route is even matched to a row, so a made-up id is enough.
  return path.replace(/\{(\w+)\}/g, (_m, name: string) => values[name] ?? '999999');
}

/** A request from the admin's browser: its session cookie, the given XSRF cookie and headers. */
function forged(op: Operation, xsrfCookie: string | undefined, headers: Record<string, string>) {
  const cookies = [`tw.sid=${adminSession}`, ...(xsrfCookie ? [`XSRF-TOKEN=${encodeURIComponent(xsrfCookie)}`] : [])];
  let req = request(t.app)[op.method](`${concretePath(op.path)}`).set('Cookie', cookies.join('; '));
  for (const [k, v] of Object.entries(headers)) req = req.set(k, v);
  return op.operationId === 'logout' ? req : req.send({});
}

/** The token with its signature changed: same shape, wrong MAC. */
function tampered(token: string): string {
  const [nonce, mac] = token.split('.');
  const flipped = (mac![0] === 'A' ? 'B' : 'A') + mac!.slice(1);
  return `${nonce}.${flipped}`;
}

const VARIANTS: Record<string, () => { cookie: string | undefined; headers: Record<string, string> }> = {
  'no header': () => ({ cookie: adminXsrf, headers: {} }),
  'wrong token': () => ({ cookie: adminXsrf, headers: { 'X-XSRF-TOKEN': tampered(adminXsrf) } }),
  'token of another session': () => ({ cookie: otherXsrf, headers: { 'X-XSRF-TOKEN': otherXsrf } }),
  'cross-site Origin': () => ({ cookie: adminXsrf, headers: { 'X-XSRF-TOKEN': adminXsrf, Origin: 'https://attacker.example' } }),
  'Sec-Fetch-Site cross-site': () => ({ cookie: adminXsrf, headers: { 'X-XSRF-TOKEN': adminXsrf, 'Sec-Fetch-Site': 'cross-site' } }),
};

async function snapshot() {
  const db = t.ctx.db;
  return {
    seasons: (await db.selectFrom('seasons').select('id').where('team_id', '=', team.teamId).execute()).length,
    players: (await db.selectFrom('players').select('id').where('team_id', '=', team.teamId).execute()).length,
    invitation: await db.selectFrom('invitations').select(['token_hash', 'revoked_at', 'expires_at']).where('id', '=', invitationId).executeTakeFirstOrThrow(),
    coachRole: (await db.selectFrom('memberships').select(['role', 'active']).where('id', '=', coachMembershipId).executeTakeFirstOrThrow()),
    sessions: (await db.selectFrom('session').select('sid').execute()).length,
    resets: (await db.selectFrom('password_resets').select('id').execute()).length,
  };
}

test('the document lists the state-changing routes this test must cover', () => {
  const ids = operations.map((o) => o.operationId);
  expect(ids).toEqual(
    expect.arrayContaining([
      'login', 'logout', 'requestPasswordReset', 'confirmPasswordReset', 'acceptInvitation', 'createSeason', 'addPlayer',
      'updatePlayer', 'importRoster', 'createInvitation', 'resendInvitation', 'revokeInvitation', 'updateMember',
    ]),
  );
  expect(operations.every((o) => ['post', 'put', 'patch', 'delete'].includes(o.method))).toBe(true);
});

test('every state-changing route × every forgery → 403 csrf_rejected, nothing changes; the real token passes', async () => {
  const before = await snapshot();
  const failures: string[] = [];
  let rejected = 0;
  for (const op of operations) {
    for (const [name, variant] of Object.entries(VARIANTS)) {
      const { cookie, headers } = variant();
      const res = await forged(op, cookie, headers);
      if (res.status !== 403 || res.body?.error?.code !== 'csrf_rejected') {
        failures.push(`${op.method.toUpperCase()} ${op.path} with ${name}: ${res.status} ${JSON.stringify(res.body)}`);
      } else {
        expect(res.body.error.message).toEqual(expect.any(String));
        rejected += 1;
      }
    }
  }
  expect(failures).toEqual([]);
  expect(rejected).toBe(operations.length * Object.keys(VARIANTS).length);
  expect(await snapshot()).toEqual(before);
  // The admin is still signed in: no forged sign-out or sign-in got through.
  expect((await admin.get('/api/auth/me')).body.user.email).toBe(team.accounts.admin.email);

  // Controls: the same requests with the right token and a same-origin browser's headers get past CSRF.
  for (const op of operations) {
    const res = await forged(op, adminXsrf, { 'X-XSRF-TOKEN': adminXsrf, 'Sec-Fetch-Site': 'same-origin' });
    // 401 would mean the admin's session was lost on the way; 403 that CSRF refused a genuine request.
    if (res.status === 403 || res.status === 401 || res.status >= 500) failures.push(`control ${op.method.toUpperCase()} ${op.path}: ${res.status} ${JSON.stringify(res.body)}`);
  }
  expect(failures).toEqual([]);
});

describe('the XSRF-TOKEN cookie', () => {
  test('a GET hands one out when absent: readable by scripts, SameSite=Lax, Path=/', async () => {
    const res = await request(t.app).get('/api/health');
    const line = setCookieLine(res, 'XSRF-TOKEN');
    expect(line).toBeDefined();
    const attributes = line!.split(';').slice(1).map((a) => a.trim().toLowerCase());
    expect(attributes).not.toContain('httponly');
    expect(attributes).toContain('samesite=lax');
    expect(attributes).toContain('path=/');
    expect(cookieValue(res, 'XSRF-TOKEN')!.length).toBeGreaterThan(20);
  });

  test('a GET keeps a valid token and replaces a forged one', async () => {
    const first = await request(t.app).get('/api/health');
    const pre = cookieValue(first, 'tw.pre')!;
    const token = cookieValue(first, 'XSRF-TOKEN')!;
    const again = await request(t.app).get('/api/health').set('Cookie', `tw.pre=${pre}; XSRF-TOKEN=${token}`);
    expect(setCookieLine(again, 'XSRF-TOKEN')).toBeUndefined();
    const forgedCookie = await request(t.app).get('/api/health').set('Cookie', `tw.pre=${pre}; XSRF-TOKEN=forged.value`);
    expect(cookieValue(forgedCookie, 'XSRF-TOKEN')).toBeDefined();
    expect(cookieValue(forgedCookie, 'XSRF-TOKEN')).not.toBe('forged.value');
  });
});

describe('sign-in is protected by a pre-session token', () => {
  const body = () => ({ email: team.accounts.coach.email, password: TEST_PASSWORD });

  test('without any cookie or header → 403, no session', async () => {
    const res = await request(t.app).post('/api/auth/login').send(body());
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_rejected');
    expect(setCookieLine(res, 'tw.sid')).toBeUndefined();
  });

  test('with the pre-session cookie but no header, or a token of another browser → 403', async () => {
    const mine = await request(t.app).get('/api/health');
    const theirs = await request(t.app).get('/api/health');
    const pre = cookieValue(mine, 'tw.pre')!;
    const noHeader = await request(t.app)
      .post('/api/auth/login')
      .set('Cookie', `tw.pre=${pre}; XSRF-TOKEN=${cookieValue(mine, 'XSRF-TOKEN')}`)
      .send(body());
    expect(noHeader.status).toBe(403);
    expect(noHeader.body.error.code).toBe('csrf_rejected');
    const theirToken = decodeURIComponent(cookieValue(theirs, 'XSRF-TOKEN')!);
    const planted = await request(t.app)
      .post('/api/auth/login')
      .set('Cookie', `tw.pre=${pre}; XSRF-TOKEN=${encodeURIComponent(theirToken)}`)
      .set('X-XSRF-TOKEN', theirToken)
      .send(body());
    expect(planted.status).toBe(403);
    expect(planted.body.error.code).toBe('csrf_rejected');
    expect(setCookieLine(planted, 'tw.sid')).toBeUndefined();
  });

  test('with its own pre-session token → 200', async () => {
    const client = t.client();
    expect((await client.login(team.accounts.coach.email, TEST_PASSWORD)).status).toBe(200);
  });

  test('after sign-in the pre-session token no longer works; after sign-out the session token no longer works', async () => {
    const client = t.client();
    const primed = await client.get('/api/health');
    const pre = cookieValue(primed, 'tw.pre')!;
    const preToken = client.xsrfToken!;
    const login = await client.login(team.accounts.analyst.email, TEST_PASSWORD);
    expect(login.status).toBe(200);
    const session = cookieValue(login, 'tw.sid')!;
    const sessionToken = client.xsrfToken!;
    expect(sessionToken).not.toBe(preToken);

    // Header and cookie agree, but the token is bound to the pre-session, not to this session.
    const stale = await request(t.app)
      .post('/api/auth/logout')
      .set('Cookie', `tw.pre=${pre}; tw.sid=${session}; XSRF-TOKEN=${encodeURIComponent(preToken)}`)
      .set('X-XSRF-TOKEN', preToken);
    expect(stale.status).toBe(403);
    expect(stale.body.error.code).toBe('csrf_rejected');
    expect((await client.get('/api/auth/me')).status).toBe(200);

    expect((await client.post('/api/auth/logout')).status).toBe(204);
    const afterLogout = await request(t.app)
      .post('/api/auth/login')
      .set('Cookie', `tw.pre=${pre}; XSRF-TOKEN=${encodeURIComponent(sessionToken)}`)
      .set('X-XSRF-TOKEN', sessionToken)
      .send({ email: team.accounts.analyst.email, password: TEST_PASSWORD });
    expect(afterLogout.status).toBe(403);
    expect(afterLogout.body.error.code).toBe('csrf_rejected');
    // With the token handed out at sign-out, sign-in works again.
    expect((await client.login(team.accounts.analyst.email, TEST_PASSWORD)).status).toBe(200);
  });
});
