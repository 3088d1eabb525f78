import { loadConfig } from '../../server/core/config';
import { registerSchedules } from '../../workers/schedules';
import { createTeamFixture, type TeamFixture } from '../support/fixtures';
import { listMail } from '../support/mailbox';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * The weekly development summary on its schedule: the worker registers the cron (or removes it when
 * turned off), each tick queues one summary per team with players — once even when a tick repeats
 * within hours — and the mail reads the player's trend the way his Progress page does.
 */
jest.setTimeout(60_000);

let t: TestApp;
let team: TeamFixture;

beforeAll(async () => {
  t = await startTestApp();
  await t.startWorker();
  team = await createTeamFixture(t.ctx.db, 'Weekly');
  // The player's account is the left guard. Five Monday practices, one a week: 0, 1, 2, 3 and 4 plus
  // of 4 snaps — a straight line up 25 points a week, which the trend reads as "improving".
  const LG = team.ownPlayerId;
  for (let week = 0; week < 5; week += 1) {
    const date = new Date(Date.UTC(2026, 8, 7 + 7 * week)).toISOString().slice(0, 10);
    const session = await t.ctx.db
      .insertInto('film_sessions')
      .values({ team_id: team.teamId, season_id: team.seasonId, kind: 'practice', title: `Week ${week + 1} practice`, date })
      .returning('id')
      .executeTakeFirstOrThrow();
    for (let order = 1; order <= 4; order += 1) {
      const snap = await t.ctx.db.insertInto('snaps').values({ session_id: session.id, order }).returning('id').executeTakeFirstOrThrow();
      const plus = order <= week;
      await t.ctx.db
        .insertInto('grades')
        .values({ snap_id: snap.id, player_id: LG, grader_id: team.accounts.coach.userId, scheme_version: 1, assignment: plus ? 'right' : 'missed', result: plus ? 'plus' : 'minus' })
        .execute();
    }
  }
});

afterAll(async () => {
  await t?.close();
});

const summariesTo = async (to: string) => (await listMail()).filter((m) => m.to.includes(to) && /week on film/.test(m.subject));

test('the worker registers the weekly cron in its time zone, and removes it when turned off', async () => {
  const config = loadConfig({ ...process.env, WEEKLY_SUMMARY_CRON: '30 7 * * 1', WEEKLY_SUMMARY_TZ: 'Etc/GMT+6' });
  await registerSchedules(t.jobs, config);
  expect(await t.jobs.boss.getSchedules()).toEqual([expect.objectContaining({ name: 'summary.weekly-all', cron: '30 7 * * 1', options: expect.objectContaining({ tz: 'Etc/GMT+6' }) })]);
  await registerSchedules(t.jobs, loadConfig({ ...process.env, WEEKLY_SUMMARY_CRON: 'off' }));
  expect(await t.jobs.boss.getSchedules()).toEqual([]);
});

test('bad schedule settings stop the process with the variable named', () => {
  expect(() => loadConfig({ ...process.env, WEEKLY_SUMMARY_CRON: 'every monday' })).toThrow(/WEEKLY_SUMMARY_CRON/);
  expect(() => loadConfig({ ...process.env, WEEKLY_SUMMARY_TZ: 'Nowhere/Land' })).toThrow(/WEEKLY_SUMMARY_TZ/);
});

test('a tick mails each player his trend reading, and a repeated tick the same day mails nothing more', async () => {
  await t.jobs.send('summary.weekly-all', {});
  const deadline = Date.now() + 20_000;
  while ((await summariesTo(team.accounts.player.email)).length === 0 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 200));
  const [mail] = await summariesTo(team.accounts.player.email);
  expect(mail).toBeDefined();
  expect(mail!.text).toContain('Your trend over 5 weeks: improving.');
  // Newest first: week 5 (4 of 4 plus) before week 1 (0 of 4).
  expect(mail!.text.indexOf('Week 5 practice: 100 % of 4 snaps')).toBeGreaterThan(-1);
  expect(mail!.text.indexOf('Week 5 practice')).toBeLessThan(mail!.text.indexOf('Week 1 practice: 0 % of 4 snaps'));

  await t.jobs.send('summary.weekly-all', {});
  await new Promise((r) => setTimeout(r, 4000));
  expect(await summariesTo(team.accounts.player.email)).toHaveLength(1);
});
