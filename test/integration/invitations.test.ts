import { randomBytes } from 'node:crypto';
import { sql } from 'kysely';
import type request from 'supertest';
import { hashLinkToken } from '../../server/core/tokens';
import type { ApiClient } from '../support/api-client';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { linkIn, listMail, type CapturedMail } from '../support/mailbox';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * Invitations end to end: the admin invites, the worker mails the link through the SMTP fake, the
 * invitee previews and accepts, then signs in. Tokens are single use, expire, can be revoked and
 * resent, and are stored only as a hash.
 */
const PUBLIC_URL = 'http://trenchwork.test:8080';
const NEW_PASSWORD = 'a-long-new-passphrase';
const run = randomBytes(3).toString('hex');
let counter = 0;
const address = (label: string) => `${label}-${run}-${(counter += 1)}@invite.test`;

let t: TestApp;
let team: TeamFixture;
let other: TeamFixture;
let teamName: string;
let admin: ApiClient;

beforeAll(async () => {
  t = await startTestApp({ PUBLIC_URL, INVITATION_TTL_HOURS: '1' });
  await t.startWorker();
  team = await createTeamFixture(t.ctx.db, 'Invite');
  other = await createTeamFixture(t.ctx.db, 'Elsewhere');
  teamName = (await t.ctx.db.selectFrom('teams').select('name').where('id', '=', team.teamId).executeTakeFirstOrThrow()).name;
  admin = t.client();
  expect((await admin.login(team.accounts.admin.email, TEST_PASSWORD)).status).toBe(200);
});

afterAll(async () => {
  await t?.close();
});

afterEach(() => {
  t.clock.offsetMs = 0;
});

/** Waits for an invitation mail to `to` whose token is not in `seen`; returns the token from its /join link. */
async function mailedToken(to: string, seen: readonly string[] = []): Promise<{ token: string; link: string; mail: CapturedMail }> {
  const deadline = Date.now() + 15_000;
  for (;;) {
    for (const mail of await listMail()) {
      if (!mail.to.toLowerCase().includes(to.toLowerCase())) continue;
      const link = linkIn(mail, '/join');
      const token = new URL(link).searchParams.get('token')!;
      if (!seen.includes(token)) return { token, link, mail };
    }
    if (Date.now() > deadline) throw new Error(`No new invitation mail to ${to} within 15 s`);
    await new Promise((resolve) => setTimeout(resolve, 150));
  }
}

function invite(body: Record<string, unknown>, client: ApiClient = admin): Promise<request.Response> {
  return client.post(`/api/teams/${team.teamId}/invitations`, body);
}

const preview = (token: string) => t.client().get(`/api/invitations/${encodeURIComponent(token)}`);
const accept = (token: string, password = NEW_PASSWORD, name = 'Reese Calder') => t.client().post('/api/invitations/accept', { token, name, password });

function expectTokenInvalid(res: request.Response): void {
  expect(res.status).toBe(400);
  expect(res.body.error.code).toBe('token_invalid');
}

test('admin invites a coach → mail → preview → accept → the coach signs in with the new password', async () => {
  const email = address('coach');
  const created = await invite({ email, role: 'coach' });
  expect(created.status).toBe(201);
  expect(created.body).toStrictEqual({
    id: expect.any(Number),
    email,
    role: 'coach',
    playerId: null,
    invitedBy: 'Invite admin',
    createdAt: expect.any(String),
    expiresAt: expect.any(String),
    lastSentAt: expect.any(String),
  });
  expect(Math.abs(Date.parse(created.body.expiresAt) - (Date.now() + 3_600_000))).toBeLessThan(60_000);

  const { token, link, mail } = await mailedToken(email);
  expect(mail.subject).toBe(`You're invited to ${teamName} on Trenchwork`);
  // Built from the configured base URL, never from the request's Host header.
  expect(link.startsWith(`${PUBLIC_URL}/join?token=`)).toBe(true);
  // ≥ 128 bits: 32 random bytes in base64url are 43 characters.
  expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);

  const shown = await preview(token);
  expect(shown.status).toBe(200);
  expect(shown.body).toStrictEqual({ email, teamName, role: 'coach', hasAccount: false });

  const accepted = await accept(token);
  expect(accepted.status).toBe(204);
  // No automatic sign-in: the new account signs in itself.
  expect(String(accepted.headers['set-cookie'] ?? '')).not.toContain('tw.sid=');

  const coach = t.client();
  const login = await coach.login(email, NEW_PASSWORD);
  expect(login.status).toBe(200);
  const me = await coach.get('/api/auth/me');
  expect(me.body).toStrictEqual({
    user: { id: expect.any(Number), email, name: 'Reese Calder' },
    memberships: [{ teamId: team.teamId, teamName, role: 'coach' }],
  });
  // The new membership works at once: a coach may read the roster.
  expect((await coach.get(`/api/teams/${team.teamId}/players`)).status).toBe(200);

  // Single use.
  expectTokenInvalid(await accept(token, 'another-long-passphrase'));
  expectTokenInvalid(await preview(token));
  const staff = await admin.get(`/api/teams/${team.teamId}/staff`);
  expect(staff.body.invitations.map((i: { email: string }) => i.email)).not.toContain(email);
  expect(staff.body.members.find((m: { email: string }) => m.email === email)).toMatchObject({ role: 'coach', active: true, name: 'Reese Calder' });
});

test('a wrong token → 400 token_invalid for preview and accept', async () => {
  const made = randomBytes(32).toString('base64url');
  expectTokenInvalid(await preview(made));
  expectTokenInvalid(await accept(made));
});

test('an expired token → 400; the address can then be invited again and the old link stays dead', async () => {
  const email = address('late');
  expect((await invite({ email, role: 'analyst' })).status).toBe(201);
  const { token } = await mailedToken(email);
  expect((await preview(token)).status).toBe(200);

  t.clock.offsetMs = 61 * 60_000;
  expectTokenInvalid(await preview(token));
  expectTokenInvalid(await accept(token));
  const again = await invite({ email, role: 'analyst' });
  expect(again.status).toBe(201);

  t.clock.offsetMs = 0;
  expectTokenInvalid(await preview(token));
  const { token: fresh } = await mailedToken(email, [token]);
  expect((await preview(fresh)).status).toBe(200);
});

test('a revoked invitation → 400; revoking twice → 404', async () => {
  const email = address('revoked');
  const created = await invite({ email, role: 'coach' });
  const { token } = await mailedToken(email);
  const revoked = await admin.delete(`/api/teams/${team.teamId}/invitations/${created.body.id}`);
  expect(revoked.status).toBe(204);
  expectTokenInvalid(await preview(token));
  expectTokenInvalid(await accept(token));
  expect((await admin.delete(`/api/teams/${team.teamId}/invitations/${created.body.id}`)).status).toBe(404);
});

test('resend mails a new token; the old one stops working', async () => {
  const email = address('resend');
  const created = await invite({ email, role: 'coordinator' });
  const { token: first } = await mailedToken(email);
  const resent = await admin.post(`/api/teams/${team.teamId}/invitations/${created.body.id}/resend`);
  expect(resent.status).toBe(200);
  expect(resent.body.id).toBe(created.body.id);
  expect(Date.parse(resent.body.lastSentAt)).toBeGreaterThanOrEqual(Date.parse(created.body.lastSentAt));
  const { token: second } = await mailedToken(email, [first]);
  expect(second).not.toBe(first);
  expectTokenInvalid(await preview(first));
  expectTokenInvalid(await accept(first));
  expect((await preview(second)).body.role).toBe('coordinator');
  expect((await accept(second)).status).toBe(204);
});

test('a player invitation needs a roster entry of this team without an account, and links the account', async () => {
  const email = address('player');
  const missing = await invite({ email, role: 'player' });
  expect(missing.status).toBe(422);
  expect(missing.body.error.fields.playerId).toEqual(expect.any(String));
  const linked = await invite({ email, role: 'player', playerId: team.ownPlayerId });
  expect(linked.status).toBe(409);
  expect(linked.body.error.fields.playerId).toEqual(expect.any(String));
  const foreign = await invite({ email, role: 'player', playerId: other.playerIds[0] });
  expect(foreign.status).toBe(422);
  expect(foreign.body.error.fields.playerId).toEqual(expect.any(String));

  const created = await invite({ email, role: 'player', playerId: team.playerIds[0] });
  expect(created.status).toBe(201);
  expect(created.body.playerId).toBe(team.playerIds[0]);
  const { token } = await mailedToken(email);
  expect((await preview(token)).body).toStrictEqual({ email, teamName, role: 'player', playerName: 'Avery Lintel', hasAccount: false });
  expect((await accept(token, NEW_PASSWORD, 'Avery Lintel')).status).toBe(204);

  const player = t.client();
  expect((await player.login(email, NEW_PASSWORD)).status).toBe(200);
  const me = await player.get('/api/auth/me');
  expect(me.body.memberships).toStrictEqual([{ teamId: team.teamId, teamName, role: 'player', playerId: team.playerIds[0] }]);
  const roster = await admin.get(`/api/teams/${team.teamId}/players`);
  expect(roster.body.players.find((p: { id: number }) => p.id === team.playerIds[0]).accountEmail).toBe(email);
});

test('a second pending invitation for the same address → 409; inviting a member → 409', async () => {
  const email = address('twice');
  expect((await invite({ email, role: 'coach' })).status).toBe(201);
  const again = await invite({ email: email.toUpperCase(), role: 'analyst' });
  expect(again.status).toBe(409);
  expect(again.body.error.code).toBe('conflict');
  expect(again.body.error.fields.email).toEqual(expect.any(String));
  const member = await invite({ email: team.accounts.coach.email, role: 'analyst' });
  expect(member.status).toBe(409);
  expect(member.body.error.fields.email).toEqual(expect.any(String));
});

test('a weak password → 422 naming the password; the invitation stays usable', async () => {
  const email = address('weak');
  expect((await invite({ email, role: 'coach' })).status).toBe(201);
  const { token } = await mailedToken(email);
  const short = await accept(token, 'short');
  expect(short.status).toBe(422);
  expect(short.body.error.code).toBe('validation_failed');
  expect(short.body.error.fields.password).toBe('Use at least 8 characters.');
  const common = await accept(token, 'Password123');
  expect(common.status).toBe(422);
  expect(common.body.error.fields.password).toMatch(/too common/);
  expect((await preview(token)).status).toBe(200);
  expect((await accept(token)).status).toBe(204);
});

test('an address that already has an account joins with that account’s password', async () => {
  const email = other.accounts.coach.email;
  expect((await invite({ email, role: 'analyst' })).status).toBe(201);
  const { token } = await mailedToken(email);
  expect((await preview(token)).body.hasAccount).toBe(true);
  const wrong = await accept(token, 'not-my-password', 'Someone Else');
  expect(wrong.status).toBe(422);
  expect(wrong.body.error.fields.password).toEqual(expect.any(String));
  expect((await accept(token, TEST_PASSWORD, 'Someone Else')).status).toBe(204);
  const client = t.client();
  expect((await client.login(email, TEST_PASSWORD)).status).toBe(200);
  const me = (await client.get('/api/auth/me')).body;
  expect(me.user.name).toBe('Elsewhere coach');
  expect(me.memberships.map((m: { teamId: number; role: string }) => [m.teamId, m.role]).sort()).toEqual(
    [[team.teamId, 'analyst'], [other.teamId, 'coach']].sort(),
  );
});

test('two simultaneous accepts of one token: exactly one succeeds', async () => {
  const email = address('race');
  expect((await invite({ email, role: 'coach' })).status).toBe(201);
  const { token } = await mailedToken(email);
  const results = await Promise.all([accept(token), accept(token, 'another-long-passphrase')]);
  expect(results.map((r) => r.status).sort()).toEqual([204, 400]);
  const users = await t.ctx.db.selectFrom('users').select('id').where('email', '=', email).execute();
  expect(users).toHaveLength(1);
});

describe('tokens are stored only as a hash', () => {
  let token: string;

  beforeAll(async () => {
    const email = address('hashed');
    expect((await invite({ email, role: 'coach' })).status).toBe(201);
    token = (await mailedToken(email)).token;
    const row = await t.ctx.db.selectFrom('invitations').select('token_hash').where('email', '=', email).executeTakeFirstOrThrow();
    expect(row.token_hash).toBe(hashLinkToken(token));
  });

  /** Tables (schema.table) where some row, as text, contains `needle`. */
  async function tablesContaining(needle: string, schemas: 'app' | 'all'): Promise<string[]> {
    const tables = await sql<{ schema: string; name: string }>`
      select table_schema as schema, table_name as name from information_schema.tables
      where table_type = 'BASE TABLE' and table_schema not in ('pg_catalog', 'information_schema')`.execute(t.ctx.db);
    const found: string[] = [];
    for (const { schema, name } of tables.rows) {
      if (schemas === 'app' && schema !== 'public') continue;
      const hits = await sql<{ n: number }>`select count(*)::int as n from ${sql.table(`${schema}.${name}`)} as x where x::text like ${'%' + needle + '%'}`.execute(t.ctx.db);
      if (hits.rows[0]!.n > 0) found.push(`${schema}.${name}`);
    }
    return found;
  }

  test("no row of the application's tables contains the raw token", async () => {
    expect(await tablesContaining(token, 'app')).toEqual([]);
  });

  test('no row anywhere in the database (job queue included) contains the raw token', async () => {
    expect(await tablesContaining(token, 'all')).toEqual([]);
  });
});
