import { createTeamFixture, type TeamFixture } from '../support/fixtures';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * GET /api/dev/mail, the development mailbox's feed (issue 2's contract): the mail the SMTP fake
 * captured as {"messages":[{"to","subject","text","date"}]}, newest first — and no such route at all
 * in production.
 */
jest.setTimeout(60_000);

let t: TestApp;
let team: TeamFixture;

beforeAll(async () => {
  t = await startTestApp();
  await t.startWorker();
  team = await createTeamFixture(t.ctx.db, 'Mailfeed');
});

afterAll(async () => {
  await t?.close();
});

async function messagesTo(to: string): Promise<{ to: string; subject: string; text: string; date: string }[]> {
  const res = await t.client().get('/api/dev/mail');
  expect(res.status).toBe(200);
  return res.body.messages.filter((m: { to: string }) => m.to.includes(to));
}

test('captured mail in the contract shape, newest first', async () => {
  // Two reset mails, the coach's first, then the analyst's a moment later.
  for (const email of [team.accounts.coach.email, team.accounts.analyst.email]) {
    expect((await t.client().post('/api/auth/password-reset/request', { email })).status).toBe(202);
    const deadline = Date.now() + 15_000;
    while ((await messagesTo(email)).length === 0 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 200));
    await new Promise((r) => setTimeout(r, 1100));
  }
  const all = (await t.client().get('/api/dev/mail')).body.messages as { to: string; subject: string; text: string; date: string }[];
  const ours = all.filter((m) => m.to.includes(team.accounts.coach.email) || m.to.includes(team.accounts.analyst.email));
  expect(ours.map((m) => m.to)).toEqual([expect.stringContaining(team.accounts.analyst.email), expect.stringContaining(team.accounts.coach.email)]);
  for (const m of ours) {
    expect(m).toEqual(expect.objectContaining({ to: expect.any(String), subject: expect.any(String), text: expect.stringContaining('/reset-password'), date: expect.any(String) }));
    expect(Number.isNaN(Date.parse(m.date))).toBe(false);
  }
  // Newest first over the whole feed, not only ours.
  const dates = all.map((m) => Date.parse(m.date));
  expect(dates).toEqual([...dates].sort((a, b) => b - a));
});

test('production mounts no development route: 404, and the OpenAPI document does not list it', async () => {
  const production = await startTestApp({
    NODE_ENV: 'production',
    SESSION_SECRET: 'p'.repeat(40),
    PUBLIC_URL: 'http://127.0.0.1:9',
    SMTP_URL: process.env.SMTP_URL ?? 'smtp://127.0.0.1:9',
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
  });
  try {
    expect(production.config.env).toBe('production');
    const res = await production.client().get('/api/dev/mail');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toEqual(expect.any(String));
    const doc = await production.client().get('/api/openapi.json');
    expect(Object.keys(doc.body.paths)).not.toContain('/api/dev/mail');
    expect(Object.keys((await t.client().get('/api/openapi.json')).body.paths)).toContain('/api/dev/mail');
  } finally {
    await production.close();
  }
});
