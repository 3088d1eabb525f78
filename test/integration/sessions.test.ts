import { sql } from 'kysely';
import request from 'supertest';
import { hashLinkToken } from '../../server/core/tokens';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * Sessions: a new id at every sign-in (fixation), sign-out destroys the session, idle and absolute
 * timeouts, cookie attributes, the /api/auth/me contract, and sessions ending on a password reset.
 */
const COOKIE = 'tw.sid';

function setCookies(res: request.Response): string[] {
  return ([] as string[]).concat((res.headers['set-cookie'] as unknown as string[] | undefined) ?? []);
}

/** The whole Set-Cookie line for `name`, or undefined. */
function setCookieLine(res: request.Response, name: string): string | undefined {
  return setCookies(res).find((c) => c.startsWith(`${name}=`));
}

function cookieValue(res: request.Response, name: string): string | undefined {
  const line = setCookieLine(res, name);
  return line ? line.slice(name.length + 1).split(';')[0] : undefined;
}

/** The session id inside express-session's signed cookie value ("s:<sid>.<signature>", URL-encoded). */
function sidOf(cookie: string): string {
  const decoded = decodeURIComponent(cookie);
  expect(decoded.startsWith('s:')).toBe(true);
  return decoded.slice(2, decoded.lastIndexOf('.'));
}

/** When the browser drops the cookie (express-session writes Expires, not Max-Age), in ms since the epoch. */
function cookieExpiry(res: request.Response, name: string): number {
  const match = /Expires=([^;]+)/i.exec(setCookieLine(res, name) ?? '');
  expect(match).not.toBeNull();
  return Date.parse(match![1]!);
}

function meWith(t: TestApp, cookie: string) {
  return request(t.app).get('/api/auth/me').set('Cookie', `${COOKIE}=${cookie}`);
}

async function sessionRows(t: TestApp, sid: string): Promise<number> {
  const rows = await t.ctx.db.selectFrom('session').select('sid').where('sid', '=', sid).execute();
  return rows.length;
}

async function storedExpiry(t: TestApp, sid: string): Promise<number> {
  // expire is a timestamp without time zone written in the pool's UTC session.
  const row = await sql<{ ms: number }>`select (extract(epoch from (expire at time zone 'UTC')) * 1000)::float8 as ms from session where sid = ${sid}`.execute(t.ctx.db);
  return row.rows[0]!.ms;
}

let t: TestApp;
let team: TeamFixture;
let teamName: string;

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeamFixture(t.ctx.db, 'Sessions');
  teamName = (await t.ctx.db.selectFrom('teams').select('name').where('id', '=', team.teamId).executeTakeFirstOrThrow()).name;
});

afterAll(async () => {
  await t?.close();
});

afterEach(() => {
  t.clock.offsetMs = 0;
});

describe('session id and sign-in', () => {
  test('no session cookie is handed out before sign-in (saveUninitialized false)', async () => {
    const client = t.client();
    const health = await client.get('/api/health');
    expect(health.status).toBe(200);
    expect(setCookieLine(health, COOKIE)).toBeUndefined();
    const me = await client.get('/api/auth/me');
    expect(me.status).toBe(401);
    expect(me.body.error.code).toBe('unauthenticated');
    expect(setCookieLine(me, COOKIE)).toBeUndefined();
  });

  test('signing in again from the same client gives a new session id and the old one stops working', async () => {
    const client = t.client();
    const first = await client.login(team.accounts.coach.email, TEST_PASSWORD);
    expect(first.status).toBe(200);
    const a = cookieValue(first, COOKIE)!;
    expect(a).toBeDefined();
    expect((await meWith(t, a)).status).toBe(200);

    const second = await client.login(team.accounts.analyst.email, TEST_PASSWORD);
    expect(second.status).toBe(200);
    const b = cookieValue(second, COOKIE)!;
    expect(b).toBeDefined();
    expect(sidOf(b)).not.toBe(sidOf(a));

    const oldMe = await meWith(t, a);
    expect(oldMe.status).toBe(401);
    expect(oldMe.body.error.code).toBe('unauthenticated');
    expect(await sessionRows(t, sidOf(a))).toBe(0);

    const newMe = await meWith(t, b);
    expect(newMe.status).toBe(200);
    expect(newMe.body.user.email).toBe(team.accounts.analyst.email);
  });

  test('a session cookie planted before sign-in is replaced, and the planted id never carries the victim', async () => {
    // The attacker signs in and plants his own session cookie in the victim's browser.
    const attacker = t.client();
    const planted = cookieValue(await attacker.login(team.accounts.analyst.email, TEST_PASSWORD), COOKIE)!;

    const primed = await request(t.app).get('/api/health').set('Cookie', `${COOKIE}=${planted}`);
    const xsrf = decodeURIComponent(cookieValue(primed, 'XSRF-TOKEN')!);
    const login = await request(t.app)
      .post('/api/auth/login')
      .set('Cookie', `${COOKIE}=${planted}; XSRF-TOKEN=${encodeURIComponent(xsrf)}`)
      .set('X-XSRF-TOKEN', xsrf)
      .send({ email: team.accounts.coordinator.email, password: TEST_PASSWORD });
    expect(login.status).toBe(200);
    const victim = cookieValue(login, COOKIE)!;
    expect(sidOf(victim)).not.toBe(sidOf(planted));

    const withPlanted = await meWith(t, planted);
    // The planted id is gone (regenerated away) rather than now belonging to the victim.
    expect(withPlanted.status).toBe(401);
    const withVictim = await meWith(t, victim);
    expect(withVictim.status).toBe(200);
    expect(withVictim.body.user.email).toBe(team.accounts.coordinator.email);
  });
});

describe('sign-out', () => {
  test('sign-out destroys the session: the old cookie is rejected and the row is gone', async () => {
    const client = t.client();
    const login = await client.login(team.accounts.coach.email, TEST_PASSWORD);
    const cookie = cookieValue(login, COOKIE)!;
    expect(await sessionRows(t, sidOf(cookie))).toBe(1);

    const out = await client.post('/api/auth/logout');
    expect(out.status).toBe(204);
    // The browser is told to drop the cookie.
    expect(setCookieLine(out, COOKIE)).toMatch(/Expires=Thu, 01 Jan 1970/);

    expect(await sessionRows(t, sidOf(cookie))).toBe(0);
    const replay = await meWith(t, cookie);
    expect(replay.status).toBe(401);
    expect((await client.get('/api/auth/me')).status).toBe(401);
  });

  test('sign-out without a session answers 204', async () => {
    const client = t.client();
    const out = await client.post('/api/auth/logout');
    expect(out.status).toBe(204);
  });
});

describe('timeouts', () => {
  test('idle timeout: the cookie and the stored session last SESSION_IDLE_MINUTES; every request renews the cookie, the store at most once a minute', async () => {
    const idleMs = t.config.sessionIdleMs;
    expect(idleMs).toBe(180 * 60_000);
    const client = t.client();
    const login = await client.login(team.accounts.coach.email, TEST_PASSWORD);
    expect(Math.abs(cookieExpiry(login, COOKIE) - (Date.now() + idleMs))).toBeLessThan(60_000);
    const sid = sidOf(cookieValue(login, COOKIE)!);
    expect(Math.abs((await storedExpiry(t, sid)) - (Date.now() + idleMs))).toBeLessThan(60_000);

    // Almost idle for the whole period.
    await sql`update session set expire = (now() at time zone 'UTC') + interval '1 minute' where sid = ${sid}`.execute(t.ctx.db);
    // Within a minute of the sign-in's write the cookie rolls, but the store is not written again.
    const soon = await client.get('/api/auth/me');
    expect(soon.status).toBe(200);
    expect(Math.abs(cookieExpiry(soon, COOKIE) - (Date.now() + idleMs))).toBeLessThan(60_000);
    expect(Math.abs((await storedExpiry(t, sid)) - (Date.now() + 60_000))).toBeLessThan(30_000);

    // A minute on (the app's clock), one request renews the stored expiry too (rolling).
    t.clock.offsetMs = 61_000;
    const me = await client.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(Math.abs(cookieExpiry(me, COOKIE) - (Date.now() + idleMs))).toBeLessThan(60_000);
    expect(Math.abs((await storedExpiry(t, sid)) - (Date.now() + idleMs))).toBeLessThan(60_000);

    // Idle for the whole period: the store no longer hands the session out.
    await sql`update session set expire = (now() at time zone 'UTC') - interval '1 second' where sid = ${sid}`.execute(t.ctx.db);
    const late = await client.get('/api/auth/me');
    expect(late.status).toBe(401);
    expect(late.body.error.code).toBe('unauthenticated');
  });

  test('absolute timeout: after SESSION_ABSOLUTE_HOURS the session ends even while in use', async () => {
    const short = await startTestApp({ SESSION_ABSOLUTE_HOURS: '1' });
    try {
      const fixture = await createTeamFixture(short.ctx.db, 'Absolute');
      const client = short.client();
      const login = await client.login(fixture.accounts.coach.email, TEST_PASSWORD);
      expect(login.status).toBe(200);
      const sid = sidOf(cookieValue(login, COOKIE)!);

      short.clock.offsetMs = 59 * 60_000;
      expect((await client.get('/api/auth/me')).status).toBe(200);

      short.clock.offsetMs = 61 * 60_000;
      const expired = await client.get('/api/auth/me');
      expect(expired.status).toBe(401);
      expect(expired.body.error.code).toBe('unauthenticated');
      expect(await sessionRows(short, sid)).toBe(0);

      // Destroyed, not hidden: back at the real time the cookie still does not work.
      short.clock.offsetMs = 0;
      expect((await client.get('/api/auth/me')).status).toBe(401);

      // Signing in again starts a fresh session.
      short.clock.offsetMs = 61 * 60_000;
      expect((await client.login(fixture.accounts.coach.email, TEST_PASSWORD)).status).toBe(200);
      expect((await client.get('/api/auth/me')).status).toBe(200);
    } finally {
      await short.close();
    }
  });
});

describe('cookies', () => {
  test('session cookie: own name, HttpOnly, SameSite=Lax, Path=/, not the default connect.sid', async () => {
    const client = t.client();
    const primed = await client.get('/api/health');
    const login = await client.login(team.accounts.coach.email, TEST_PASSWORD);
    const all = [...setCookies(primed), ...setCookies(login)];
    expect(all.some((c) => c.startsWith('connect.sid='))).toBe(false);

    const line = setCookieLine(login, COOKIE)!;
    expect(line).toBeDefined();
    const attributes = line.split(';').slice(1).map((a) => a.trim().toLowerCase());
    expect(attributes).toContain('httponly');
    expect(attributes).toContain('samesite=lax');
    expect(attributes).toContain('path=/');
    expect(attributes.some((a) => a.startsWith('domain='))).toBe(false);
    // Served over plain http in this test: Secure would stop the browser from sending it.
    expect(attributes).not.toContain('secure');

    const pre = setCookieLine(primed, 'tw.pre')!;
    expect(pre.toLowerCase()).toContain('httponly');
    const xsrf = setCookieLine(primed, 'XSRF-TOKEN')!;
    expect(xsrf.toLowerCase()).not.toContain('httponly');
    expect(xsrf.toLowerCase()).toContain('samesite=lax');
  });

  test('behind https: __Host- prefixed session cookie with Secure, no Domain, Path=/, and HSTS', async () => {
    const secure = await startTestApp({ PUBLIC_URL: 'https://trenchwork.test', TRUST_PROXY: 'true' });
    try {
      const fixture = await createTeamFixture(secure.ctx.db, 'Secure');
      const primed = await request(secure.app).get('/api/health').set('X-Forwarded-Proto', 'https');
      expect(primed.headers['strict-transport-security']).toMatch(/max-age=\d+/);
      expect(setCookieLine(primed, 'XSRF-TOKEN')).toMatch(/;\s*Secure/i);
      const pre = cookieValue(primed, 'tw.pre')!;
      const xsrf = cookieValue(primed, 'XSRF-TOKEN')!;
      const login = await request(secure.app)
        .post('/api/auth/login')
        .set('X-Forwarded-Proto', 'https')
        .set('Cookie', `tw.pre=${pre}; XSRF-TOKEN=${xsrf}`)
        .set('X-XSRF-TOKEN', decodeURIComponent(xsrf))
        .send({ email: fixture.accounts.coach.email, password: TEST_PASSWORD });
      expect(login.status).toBe(200);
      expect(setCookieLine(login, 'tw.sid')).toBeUndefined();
      const line = setCookieLine(login, '__Host-tw.sid')!;
      expect(line).toBeDefined();
      const attributes = line.split(';').slice(1).map((a) => a.trim().toLowerCase());
      expect(attributes).toEqual(expect.arrayContaining(['secure', 'httponly', 'samesite=lax', 'path=/']));
      expect(attributes.some((a) => a.startsWith('domain='))).toBe(false);
    } finally {
      await secure.close();
    }
  });
});

describe('GET /api/auth/me', () => {
  test.each(['admin', 'coordinator', 'coach', 'analyst', 'player'] as const)('contract for the %s account', async (role) => {
    const client = t.client();
    const login = await client.login(team.accounts[role].email, TEST_PASSWORD);
    expect(login.status).toBe(200);
    const me = await client.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.headers['cache-control']).toBe('no-store');
    const membership = { teamId: team.teamId, teamName, role, ...(role === 'player' ? { playerId: team.ownPlayerId } : {}) };
    const expected = {
      user: { id: team.accounts[role].userId, email: team.accounts[role].email, name: `Sessions ${role}` },
      memberships: [membership],
    };
    expect(me.body).toStrictEqual(expected);
    expect(Object.keys(me.body.memberships[0]).sort()).toEqual(Object.keys(membership).sort());
    // The sign-in answer is the same document.
    expect(login.body).toStrictEqual(expected);
  });

  test('an inactive membership is not listed', async () => {
    const fixture = await createTeamFixture(t.ctx.db, 'Inactive');
    await t.ctx.db.updateTable('memberships').set({ active: false }).where('user_id', '=', fixture.accounts.analyst.userId).execute();
    const client = t.client();
    expect((await client.login(fixture.accounts.analyst.email, TEST_PASSWORD)).status).toBe(200);
    expect((await client.get('/api/auth/me')).body.memberships).toEqual([]);
  });
});

describe('password reset ends sessions', () => {
  test("every session of the account ends; other accounts' sessions stay", async () => {
    const fixture = await createTeamFixture(t.ctx.db, 'Reset');
    const laptop = t.client();
    const phone = t.client();
    const otherUser = t.client();
    expect((await laptop.login(fixture.accounts.coach.email, TEST_PASSWORD)).status).toBe(200);
    expect((await phone.login(fixture.accounts.coach.email, TEST_PASSWORD)).status).toBe(200);
    expect((await otherUser.login(fixture.accounts.admin.email, TEST_PASSWORD)).status).toBe(200);

    // A reset link as requestPasswordReset would have mailed it (the mail path is in password-reset.test.ts).
    const token = 'reset-token-for-sessions-test-0123456789abcdef';
    await t.ctx.db
      .insertInto('password_resets')
      .values({ user_id: fixture.accounts.coach.userId, token_hash: hashLinkToken(token), expires_at: new Date(Date.now() + 600_000) })
      .execute();
    const confirm = await t.client().post('/api/auth/password-reset/confirm', { token, password: 'a-brand-new-passphrase' });
    expect(confirm.status).toBe(204);

    expect((await laptop.get('/api/auth/me')).status).toBe(401);
    expect((await phone.get('/api/auth/me')).status).toBe(401);
    const remaining = await sql<{ n: number }>`select count(*)::int as n from session where sess->'passport'->>'user' = ${String(fixture.accounts.coach.userId)}`.execute(t.ctx.db);
    expect(remaining.rows[0]!.n).toBe(0);
    expect((await otherUser.get('/api/auth/me')).status).toBe(200);
  });
});
