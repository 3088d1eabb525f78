import { randomBytes } from 'node:crypto';
import request from 'supertest';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { linkIn, listMail, type CapturedMail } from '../support/mailbox';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * Password reset end to end: the same answer for known and unknown addresses, mail only for the
 * known one, links built from PUBLIC_URL, single use, expiry, the old password dead, no sign-in.
 */
const PUBLIC_URL = 'http://trenchwork.test:8080';
const NEW_PASSWORD = 'fresh-passphrase-for-monday';
const run = randomBytes(3).toString('hex');

let t: TestApp;

beforeAll(async () => {
  t = await startTestApp({ PUBLIC_URL });
  await t.startWorker();
});
afterAll(async () => {
  await t?.close();
});
afterEach(() => {
  t.clock.offsetMs = 0;
});

async function resetMails(to: string): Promise<CapturedMail[]> {
  return (await listMail()).filter((m) => m.to.toLowerCase().includes(to.toLowerCase()) && m.subject === 'Reset your Trenchwork password');
}

/** Waits for a reset mail to `to` with a token not in `seen`. */
async function mailedToken(to: string, seen: readonly string[] = []): Promise<{ token: string; link: string; mail: CapturedMail }> {
  const deadline = Date.now() + 15_000;
  for (;;) {
    for (const mail of await resetMails(to)) {
      const link = linkIn(mail, '/reset-password');
      const token = new URL(link).searchParams.get('token')!;
      if (!seen.includes(token)) return { token, link, mail };
    }
    if (Date.now() > deadline) throw new Error(`No new reset mail to ${to} within 15 s`);
    await new Promise((resolve) => setTimeout(resolve, 150));
  }
}

const ask = (email: string) => t.client().post('/api/auth/password-reset/request', { email });
const confirm = (token: string, password = NEW_PASSWORD) => t.client().post('/api/auth/password-reset/confirm', { token, password });
const login = (email: string, password: string) => t.client().login(email, password);

function setsSession(res: request.Response): boolean {
  return ([] as string[]).concat((res.headers['set-cookie'] as unknown as string[] | undefined) ?? []).some((c) => c.startsWith('tw.sid='));
}

async function fixture(label: string): Promise<TeamFixture> {
  return createTeamFixture(t.ctx.db, label);
}

test('known and unknown address: identical 202 answers; mail only to the known one', async () => {
  const team = await fixture('Known');
  const known = team.accounts.coach.email;
  const unknown = `nobody-${run}@known.test`;
  const a = await ask(known);
  const b = await ask(unknown);
  expect(a.status).toBe(202);
  expect(b.status).toBe(202);
  expect(a.body).toStrictEqual({});
  expect(b.body).toStrictEqual(a.body);
  expect(b.headers['content-type']).toBe(a.headers['content-type']);
  expect(setsSession(a) || setsSession(b)).toBe(false);

  const { mail } = await mailedToken(known);
  expect(mail.text).toContain('Hi Known coach,');
  // The worker has sent the known one; give a wrongly queued second mail time to show up too.
  await new Promise((resolve) => setTimeout(resolve, 2000));
  expect(await resetMails(unknown)).toEqual([]);
  expect(await resetMails(known)).toHaveLength(1);
});

test('the link uses PUBLIC_URL, not the Host header; it resets the password once, with no sign-in', async () => {
  const team = await fixture('Link');
  const email = team.accounts.analyst.email;
  const signedIn = t.client();
  expect((await signedIn.login(email, TEST_PASSWORD)).status).toBe(200);

  const spoofed = t.client();
  await spoofed.prime();
  expect((await spoofed.send('post', '/api/auth/password-reset/request', { email }, { Host: 'attacker.example' })).status).toBe(202);
  const { token, link } = await mailedToken(email);
  expect(link.startsWith(`${PUBLIC_URL}/reset-password?token=`)).toBe(true);
  expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);

  const anonymous = t.client();
  const done = await anonymous.post('/api/auth/password-reset/confirm', { token, password: NEW_PASSWORD });
  expect(done.status).toBe(204);
  expect(setsSession(done)).toBe(false);
  expect((await anonymous.get('/api/auth/me')).status).toBe(401);

  expect((await login(email, TEST_PASSWORD)).status).toBe(401);
  expect((await login(email, NEW_PASSWORD)).status).toBe(200);
  // The session that was open before the reset has ended.
  expect((await signedIn.get('/api/auth/me')).status).toBe(401);

  const again = await confirm(token, 'yet-another-passphrase');
  expect(again.status).toBe(400);
  expect(again.body.error.code).toBe('token_invalid');
  expect((await login(email, NEW_PASSWORD)).status).toBe(200);
});

test('an expired link → 400 and the password stays as it was', async () => {
  const team = await fixture('Expiry');
  const email = team.accounts.coordinator.email;
  expect((await ask(email)).status).toBe(202);
  const { token } = await mailedToken(email);
  t.clock.offsetMs = t.config.passwordResetTtlMs + 60_000;
  const late = await confirm(token);
  expect(late.status).toBe(400);
  expect(late.body.error.code).toBe('token_invalid');
  t.clock.offsetMs = 0;
  expect((await login(email, TEST_PASSWORD)).status).toBe(200);
  expect((await login(email, NEW_PASSWORD)).status).toBe(401);
});

test('a weak new password → 422 naming the password; the link still works afterwards', async () => {
  const team = await fixture('Weak');
  const email = team.accounts.coach.email;
  expect((await ask(email.toUpperCase())).status).toBe(202);
  const { token } = await mailedToken(email);
  const short = await confirm(token, 'short');
  expect(short.status).toBe(422);
  expect(short.body.error.fields).toEqual({ password: 'Use at least 8 characters.' });
  const common = await confirm(token, 'football1');
  expect(common.status).toBe(422);
  expect(Object.keys(common.body.error.fields)).toEqual(['password']);
  expect((await confirm(token)).status).toBe(204);
});

test('using one of two outstanding links ends the other', async () => {
  const team = await fixture('Two');
  const email = team.accounts.admin.email;
  expect((await ask(email)).status).toBe(202);
  const first = await mailedToken(email);
  expect((await ask(email)).status).toBe(202);
  const second = await mailedToken(email, [first.token]);
  expect((await confirm(first.token)).status).toBe(204);
  const other = await confirm(second.token, 'second-link-passphrase');
  expect(other.status).toBe(400);
  expect(other.body.error.code).toBe('token_invalid');
  expect((await login(email, NEW_PASSWORD)).status).toBe(200);
});

test('a made-up token → 400; a deactivated account gets the same 202 and no mail', async () => {
  const made = await confirm(randomBytes(32).toString('base64url'));
  expect(made.status).toBe(400);
  expect(made.body.error.code).toBe('token_invalid');

  const team = await fixture('Inactive');
  await t.ctx.db.updateTable('users').set({ active: false }).where('id', '=', team.accounts.coach.userId).execute();
  const res = await ask(team.accounts.coach.email);
  expect(res.status).toBe(202);
  expect(res.body).toStrictEqual({});
  const rows = await t.ctx.db.selectFrom('password_resets').select('id').where('user_id', '=', team.accounts.coach.userId).execute();
  expect(rows).toEqual([]);
});
