import type { Page } from 'playwright-core';
import { startBrowserHarness, type BrowserHarness } from '../support/browser';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';

/**
 * The Sunday job in a real browser: a coach grades a five-snap session from the keyboard alone,
 * the page is reloaded half way, and every grade is checked in the database afterwards. The number
 * of keystrokes is counted and printed.
 */
let h: BrowserHarness;
let team: TeamFixture;
let sessionId: number;
let snapIds: number[];

beforeAll(async () => {
  h = await startBrowserHarness();
  const db = h.t.ctx.db;
  team = await createTeamFixture(db, 'Desk');
  const [lt, lg, c] = team.playerIds as [number, number, number];
  await db.insertInto('depth_chart_entries').values([
    { season_id: team.seasonId, position: 'LT', rank: 1, player_id: lt },
    { season_id: team.seasonId, position: 'LG', rank: 1, player_id: lg },
    { season_id: team.seasonId, position: 'C', rank: 1, player_id: c },
  ]).execute();
  const session = await db
    .insertInto('film_sessions')
    .values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: 'Week 7 vs Kestrel Lake', date: '2026-10-16', opponent: 'Kestrel Lake' })
    .returning('id')
    .executeTakeFirstOrThrow();
  sessionId = session.id;
  snapIds = [];
  for (let order = 1; order <= 5; order += 1) snapIds.push((await db.insertInto('snaps').values({ session_id: sessionId, order }).returning('id').executeTakeFirstOrThrow()).id);
});

afterAll(async () => {
  await h?.close();
});

async function signIn(page: Page): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail address').fill(team.accounts.coach.email);
  await page.getByLabel('Password', { exact: true }).fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
}

async function storedGrades() {
  return h.t.ctx.db
    .selectFrom('grades')
    .select(['snap_id', 'player_id', 'assignment', 'footwork', 'hands', 'pad_level', 'effort', 'result', 'grader_id'])
    .where('snap_id', 'in', snapIds)
    .execute();
}

async function waitForGrades(count: number, timeoutMs = 15_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while ((await storedGrades()).length < count) {
    if (Date.now() > deadline) throw new Error(`only ${(await storedGrades()).length} of ${count} grades stored`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

test('five snaps × three linemen graded from the keyboard, with a reload half way, all stored', async () => {
  const page = await h.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signIn(page);
  await page.goto(`/grading/${sessionId}?snap=${snapIds[0]}`);
  await page.getByRole('grid').waitFor();
  let keystrokes = 0;
  const press = async (key: string) => {
    keystrokes += 1;
    await page.keyboard.press(key);
  };
  await press('g'); // into the grid
  for (let snap = 0; snap < 5; snap += 1) {
    if (snap === 3) {
      // Half way: everything typed so far must survive a reload.
      await waitForGrades(9);
      await page.reload();
      await page.getByRole('grid').waitFor();
      await press('g');
    }
    await page.getByRole('grid', { name: new RegExp(`snap ${snap + 1}\\b`) }).waitFor();
    for (let row = 0; row < 3; row += 1) await press('p');
    if (snap < 4) await press('PageDown');
  }
  await waitForGrades(15);
  const grades = await storedGrades();
  expect(grades).toHaveLength(15);
  for (const g of grades) {
    expect(g).toMatchObject({ assignment: 'right', footwork: 'plus', hands: 'plus', pad_level: 'plus', effort: 'plus', result: 'plus', grader_id: team.accounts.coach.userId });
  }
  expect(new Set(grades.map((g) => `${g.snap_id}:${g.player_id}`)).size).toBe(15);
  // g, then (3 row-plus + next snap) for snaps 1–3 = 1 + 12; after the reload g again, snap 4 takes
  // 3 + next snap, snap 5 takes 3: 1 + 12 + 1 + 4 + 3 = 21 keystrokes for 15 grades. With five
  // linemen a snap takes 6 (5 row-plus + next snap): within the 10.
  console.log(`Grading Desk: 15 grades (5 snaps × 3 linemen) in ${keystrokes} keystrokes, mouse unused, one reload.`);
  expect(keystrokes).toBe(21);
  expect(errors).toEqual([]);
  await page.context().close();
});
