/// <reference lib="dom" />
import type { Page } from 'playwright-core';
import { startBrowserHarness, type BrowserHarness } from '../support/browser';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';

/**
 * Development in a real browser: a coach grades snaps (through the desk's API, as the desk does),
 * then the player's Progress page shows the new sessions in its trend chart and numbers, and the
 * Position Battle's reading changes once more snaps are graded.
 */
let h: BrowserHarness;
let team: TeamFixture;

beforeAll(async () => {
  h = await startBrowserHarness();
  team = await createTeamFixture(h.t.ctx.db, 'Battle');
});
afterAll(async () => {
  await h?.close();
});

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.pathname === '/');
}

/** A game on `date` where `plus` of `snaps` grades of `playerId` are plus. */
async function gradeGame(date: string, grades: { playerId: number; plus: number; snaps: number }[]): Promise<void> {
  const db = h.t.ctx.db;
  const coach = h.t.client();
  await coach.login(team.accounts.coach.email, TEST_PASSWORD);
  const session = await db.insertInto('film_sessions').values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: `Game ${date}`, date, opponent: 'Granite Fork' }).returning('id').executeTakeFirstOrThrow();
  const most = Math.max(...grades.map((g) => g.snaps));
  for (let order = 1; order <= most; order += 1) {
    const snap = await db.insertInto('snaps').values({ session_id: session.id, order }).returning('id').executeTakeFirstOrThrow();
    for (const g of grades.filter((x) => order <= x.snaps)) {
      const plus = order <= g.plus;
      const res = await coach.put(`/api/snaps/${snap.id}/grades/${g.playerId}`, { assignment: 'right', footwork: plus ? 'plus' : 'minus', hands: 'plus', padLevel: 'plus', effort: 'plus' });
      expect(res.status).toBe(200);
    }
  }
}

test('the Progress page and the Position Battle follow the grades', async () => {
  const [a, b] = team.playerIds as [number, number];
  await gradeGame('2026-09-04', [{ playerId: a, plus: 6, snaps: 10 }, { playerId: b, plus: 5, snaps: 10 }]);
  const page = await h.newPage();
  await signIn(page, team.accounts.coordinator.email);
  await page.goto(`/progress/${a}`);
  await page.getByTestId('trend-reading').waitFor();
  expect(await page.getByTestId('trend-reading').innerText()).toMatch(/not enough data yet/i);
  await page.locator('svg').first().waitFor();

  await page.goto(`/position-battle?players=${a},${b}`);
  const first = page.locator('.reading').first();
  await first.waitFor();
  expect(await first.innerText()).toMatch(/60 % of 10 snaps.*50 % of 10/);

  // Four more weeks: A climbs, B does not.
  await gradeGame('2026-09-11', [{ playerId: a, plus: 28, snaps: 40 }, { playerId: b, plus: 20, snaps: 40 }]);
  await gradeGame('2026-09-18', [{ playerId: a, plus: 32, snaps: 40 }, { playerId: b, plus: 20, snaps: 40 }]);
  await gradeGame('2026-09-25', [{ playerId: a, plus: 35, snaps: 40 }, { playerId: b, plus: 20, snaps: 40 }]);
  await gradeGame('2026-10-02', [{ playerId: a, plus: 38, snaps: 40 }, { playerId: b, plus: 20, snaps: 40 }]);
  await page.goto(`/progress/${a}`);
  await page.getByTestId('trend-reading').waitFor();
  await page.waitForFunction(() => /improving/i.test(document.querySelector('[data-testid="trend-reading"]')?.textContent ?? ''), null, { timeout: 10_000 });
  await page.goto(`/position-battle?players=${a},${b}`);
  await page.locator('.reading').first().waitFor();
  // A: 6 + 28 + 32 + 35 + 38 = 139 of 170 → 82 %; B: 5 + 80 = 85 of 170 → 50 %.
  expect(await page.locator('.reading').first().innerText()).toMatch(/82 % of 170 snaps.*50 % of 170.*above 0\.99/);
  await page.context().close();
}, 120_000);
