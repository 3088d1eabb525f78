import { createTeamFixture, type TeamFixture } from '../support/fixtures';
import { listMail } from '../support/mailbox';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * The reset form cannot flood an inbox: at most 3 mails per address per hour, answered the same
 * way every time; and at most 20 requests per client address per hour, then 429.
 */
let t: TestApp;
let team: TeamFixture;

beforeAll(async () => {
  t = await startTestApp();
  await t.startWorker();
  team = await createTeamFixture(t.ctx.db, 'Flood');
});
afterAll(async () => {
  await t?.close();
});

async function queuedResetMails(): Promise<number> {
  const rows = await t.ctx.db.selectFrom('password_resets').select('id').where('user_id', '=', team.accounts.coach.userId).execute();
  return rows.length;
}

test('the fourth request for one address in an hour answers 202 like the others but sends nothing', async () => {
  const client = t.client();
  const answers: string[] = [];
  for (let i = 0; i < 5; i += 1) {
    const res = await client.post('/api/auth/password-reset/request', { email: team.accounts.coach.email });
    answers.push(`${res.status} ${JSON.stringify(res.body)}`);
  }
  expect(new Set(answers)).toEqual(new Set(['202 {}']));
  expect(await queuedResetMails()).toBe(3);
  // Exactly three mails reach the SMTP fake.
  const deadline = Date.now() + 10_000;
  let mails = 0;
  while (Date.now() < deadline) {
    mails = (await listMail()).filter((m) => m.to.includes(team.accounts.coach.email)).length;
    if (mails >= 3) break;
    await new Promise((r) => setTimeout(r, 200));
  }
  await new Promise((r) => setTimeout(r, 1000));
  expect((await listMail()).filter((m) => m.to.includes(team.accounts.coach.email))).toHaveLength(3);
});

test('a client address that asks more than 20 times in an hour gets 429 with Retry-After', async () => {
  const client = t.client();
  const statuses: number[] = [];
  // 5 requests were made by the test above from the same address.
  for (let i = 0; i < 17; i += 1) statuses.push((await client.post('/api/auth/password-reset/request', { email: `nobody-${i}@flood.test` })).status);
  expect(statuses.slice(0, 15)).toEqual(Array(15).fill(202));
  expect(statuses.slice(15)).toEqual([429, 429]);
  const res = await client.post('/api/auth/password-reset/request', { email: 'nobody@flood.test' });
  expect(res.status).toBe(429);
  expect(res.body.error.code).toBe('too_many_requests');
  expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
});
