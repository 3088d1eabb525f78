import { sql } from 'kysely';
import type request from 'supertest';
import type { ApiClient } from '../support/api-client';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * Failed sign-ins are throttled per account and per address (ASVS 5.0 §6.3, SECURITY.md), and an
 * unknown address answers exactly like a wrong password. TRUST_PROXY lets each test come from its own
 * address (X-Forwarded-For, documentation ranges of RFC 5737).
 */
function attempt(client: ApiClient, email: string, password: string, ip: string): Promise<request.Response> {
  return client.send('post', '/api/auth/login', { email, password }, { 'X-Forwarded-For': ip });
}

function withoutRequestId(body: { error: Record<string, unknown> }) {
  const { requestId, ...rest } = body.error;
  expect(requestId).toEqual(expect.any(String));
  return { error: rest };
}

function hasSessionCookie(res: request.Response): boolean {
  return ([] as string[]).concat((res.headers['set-cookie'] as unknown as string[] | undefined) ?? []).some((c) => c.startsWith('tw.sid='));
}

const WINDOW_SECONDS = 15 * 60;

describe('per account (LOGIN_MAX_FAILURES_PER_ACCOUNT=3)', () => {
  let t: TestApp;
  let team: TeamFixture;

  beforeAll(async () => {
    t = await startTestApp({ LOGIN_MAX_FAILURES_PER_ACCOUNT: '3', TRUST_PROXY: 'true' });
    team = await createTeamFixture(t.ctx.db, 'Throttle');
  });
  afterAll(async () => {
    await t?.close();
  });

  test('after 3 failures the 4th attempt gets 429 with Retry-After, even with the right password, from any address', async () => {
    const client = t.client();
    const email = team.accounts.coach.email;
    for (let i = 0; i < 3; i += 1) {
      const res = await attempt(client, email, 'not-the-password', '203.0.113.10');
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe('invalid_credentials');
    }
    const locked = await attempt(client, email, TEST_PASSWORD, '203.0.113.10');
    expect(locked.status).toBe(429);
    expect(locked.body.error.code).toBe('too_many_requests');
    expect(locked.body.error.message).toMatch(/^Too many failed sign-ins\. Try again in \d+ minutes?\.$/);
    const retryAfter = Number(locked.headers['retry-after']);
    expect(Number.isInteger(retryAfter)).toBe(true);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(WINDOW_SECONDS);
    const minutes = Number(/in (\d+) minute/.exec(locked.body.error.message)![1]);
    expect(minutes).toBe(Math.ceil(retryAfter / 60));
    expect(hasSessionCookie(locked)).toBe(false);
    expect((await client.get('/api/auth/me')).status).toBe(401);

    // The lock is on the account: another address and another spelling of the address are locked too.
    expect((await attempt(t.client(), email, TEST_PASSWORD, '198.51.100.20')).status).toBe(429);
    expect((await attempt(t.client(), email.toUpperCase(), TEST_PASSWORD, '198.51.100.21')).status).toBe(429);
  });

  test('another account from the same address is not blocked', async () => {
    const client = t.client();
    for (let i = 0; i < 3; i += 1) expect((await attempt(client, team.accounts.analyst.email, 'wrong-one', '203.0.113.11')).status).toBe(401);
    expect((await attempt(client, team.accounts.analyst.email, TEST_PASSWORD, '203.0.113.11')).status).toBe(429);
    const other = await attempt(client, team.accounts.coordinator.email, TEST_PASSWORD, '203.0.113.11');
    expect(other.status).toBe(200);
    expect(other.body.user.email).toBe(team.accounts.coordinator.email);
  });

  test('the lock ends when the window has passed', async () => {
    const fixture = await createTeamFixture(t.ctx.db, 'Window');
    const client = t.client();
    for (let i = 0; i < 3; i += 1) await attempt(client, fixture.accounts.coach.email, 'wrong-one', '203.0.113.12');
    expect((await attempt(client, fixture.accounts.coach.email, TEST_PASSWORD, '203.0.113.12')).status).toBe(429);
    // rate-limiter-flexible keeps its window end in `expire` (ms since the epoch): let it pass.
    await sql`update rate_limits set expire = ${Date.now() - 1000} where key like ${'%' + fixture.accounts.coach.email}`.execute(t.ctx.db);
    expect((await attempt(client, fixture.accounts.coach.email, TEST_PASSWORD, '203.0.113.12')).status).toBe(200);
  });

  test('a successful sign-in clears the account counter', async () => {
    const fixture = await createTeamFixture(t.ctx.db, 'Reset');
    const client = t.client();
    const email = fixture.accounts.coach.email;
    for (let round = 0; round < 2; round += 1) {
      for (let i = 0; i < 2; i += 1) expect((await attempt(client, email, 'wrong-one', '203.0.113.13')).status).toBe(401);
      expect((await attempt(client, email, TEST_PASSWORD, '203.0.113.13')).status).toBe(200);
    }
  });

  test('unknown address and wrong password: identical status and body (except requestId), and both lock the same way', async () => {
    const fixture = await createTeamFixture(t.ctx.db, 'Same');
    const client = t.client();
    const unknown = 'nobody-here@same.test';
    const wrong: request.Response[] = [];
    const missing: request.Response[] = [];
    for (let i = 0; i < 4; i += 1) {
      wrong.push(await attempt(client, fixture.accounts.coach.email, 'wrong-one', '203.0.113.14'));
      missing.push(await attempt(client, unknown, 'wrong-one', '203.0.113.14'));
    }
    for (let i = 0; i < 4; i += 1) {
      expect(missing[i]!.status).toBe(wrong[i]!.status);
      expect(withoutRequestId(missing[i]!.body)).toEqual(withoutRequestId(wrong[i]!.body));
      expect(missing[i]!.headers['content-type']).toBe(wrong[i]!.headers['content-type']);
      expect(missing[i]!.headers['retry-after'] === undefined).toBe(wrong[i]!.headers['retry-after'] === undefined);
      expect(hasSessionCookie(missing[i]!)).toBe(false);
    }
    expect(wrong.map((r) => r.status)).toEqual([401, 401, 401, 429]);
    expect(withoutRequestId(wrong[0]!.body)).toEqual({ error: { code: 'invalid_credentials', message: 'That e-mail and password do not match an account.' } });
  });

  test('unknown address and wrong password take about the same time (dummy hash)', async () => {
    const fixture = await createTeamFixture(t.ctx.db, 'Timing');
    const client = t.client();
    const time = async (email: string) => {
      const started = process.hrtime.bigint();
      const res = await attempt(client, email, 'wrong-one', '203.0.113.15');
      expect(res.status).toBe(401);
      return Number(process.hrtime.bigint() - started) / 1e6;
    };
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
    const known: number[] = [];
    const unknown: number[] = [];
    const emails = [fixture.accounts.coach.email, fixture.accounts.analyst.email, fixture.accounts.coordinator.email];
    for (const [i, email] of emails.entries()) {
      known.push(await time(email));
      unknown.push(await time(`ghost-${i}@timing.test`));
    }
    // argon2 dominates both: without the dummy verification the unknown path would be ~20x faster.
    const ratio = median(unknown) / median(known);
    expect(ratio).toBeGreaterThan(0.33);
    expect(ratio).toBeLessThan(3);
  });

  test('a burst of parallel guesses gets no more password checks than the limit', async () => {
    const fixture = await createTeamFixture(t.ctx.db, 'Burst');
    const client = t.client();
    await client.prime();
    const results = await Promise.all(
      Array.from({ length: 8 }, (_, i) => attempt(client, fixture.accounts.coach.email, `guess-${i}`, '203.0.113.16')),
    );
    const statuses = results.map((r) => r.status).sort();
    const checked = statuses.filter((s) => s === 401).length;
    expect(statuses.every((s) => s === 401 || s === 429)).toBe(true);
    // 3 failures are allowed; the other 5 guesses must be refused before the password is checked.
    expect(checked).toBeLessThanOrEqual(3);
  });
});

describe('per address (LOGIN_MAX_FAILURES_PER_IP=4)', () => {
  let t: TestApp;
  let team: TeamFixture;

  beforeAll(async () => {
    t = await startTestApp({ LOGIN_MAX_FAILURES_PER_IP: '4', LOGIN_MAX_FAILURES_PER_ACCOUNT: '10', TRUST_PROXY: 'true' });
    team = await createTeamFixture(t.ctx.db, 'PerIp');
  });
  afterAll(async () => {
    await t?.close();
  });

  test('failures on several accounts add up per address; other addresses are not blocked', async () => {
    const client = t.client();
    const ip = '203.0.113.40';
    for (let i = 0; i < 2; i += 1) expect((await attempt(client, team.accounts.coach.email, 'wrong-one', ip)).status).toBe(401);
    // Below the address limit another account signs in normally.
    expect((await attempt(client, team.accounts.analyst.email, TEST_PASSWORD, ip)).status).toBe(200);
    for (let i = 0; i < 2; i += 1) expect((await attempt(client, `nobody-${i}@perip.test`, 'wrong-one', ip)).status).toBe(401);

    // 4 failures from this address: every account is refused from here, right password or not.
    const blocked = await attempt(t.client(), team.accounts.coordinator.email, TEST_PASSWORD, ip);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('too_many_requests');
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(blocked.headers['retry-after'])).toBeLessThanOrEqual(WINDOW_SECONDS);

    // The accounts themselves are not locked: from another address they sign in.
    expect((await attempt(t.client(), team.accounts.coordinator.email, TEST_PASSWORD, '198.51.100.41')).status).toBe(200);
    expect((await attempt(t.client(), team.accounts.coach.email, TEST_PASSWORD, '198.51.100.41')).status).toBe(200);
  });
});
