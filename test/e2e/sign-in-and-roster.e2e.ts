import type { Page } from 'playwright-core';
import { startBrowserHarness, type BrowserHarness } from '../support/browser';
import { DEMO_PASSWORD_FOR_TESTS, seedDemoTeam } from '../support/demo-team';

/**
 * The foundation through a real browser: each demo role signs in and sees its own navigation,
 * and the admin adds a player to the roster through the form.
 */
let h: BrowserHarness;
let teamId: number;

beforeAll(async () => {
  h = await startBrowserHarness();
  teamId = await seedDemoTeam(h.t.ctx.db);
});

afterAll(async () => {
  await h?.close();
});

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD_FOR_TESTS);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
}

/** Present in every non-production API (the harness runs NODE_ENV=test), appended after the role's links. */
const DEV_MAILBOX = 'Dev mailbox';

async function navLabels(page: Page): Promise<string[]> {
  const nav = page.getByRole('navigation', { name: 'Main' });
  // The dev mailbox link arrives last, after its probe answers: wait for it so the list is complete.
  await nav.getByRole('link', { name: DEV_MAILBOX, exact: true }).waitFor();
  // The title element only: the icon's ligature text is not part of the label.
  return (await nav.getByRole('link').locator('[matListItemTitle]').allInnerTexts()).map((t) => t.trim());
}

// Each role's whole navigation, in order, written out by hand from the roles in PRODUCT.md (not read
// from nav-links.ts) so a link given to the wrong role, a missing link or a reordering fails here.
const EXPECTED_NAV: Record<string, string[]> = {
  'admin@trenchwork.test': ['This Week', 'Film Library', 'Grading Desk', 'Cut-ups', 'Readiness Grid', 'Depth Chart', 'Position Battle', 'Calibration', 'Roster', 'Staff', 'Mail settings'],
  'coordinator@trenchwork.test': ['This Week', 'Film Library', 'Grading Desk', 'Cut-ups', 'Readiness Grid', 'Depth Chart', 'Position Battle', 'Calibration', 'Roster', 'Mail settings'],
  'coach@trenchwork.test': ['This Week', 'Film Library', 'Grading Desk', 'Cut-ups', 'Readiness Grid', 'Depth Chart', 'Position Battle', 'Calibration', 'Roster', 'Mail settings'],
  // Analysts tag film but neither grade nor write coaching points: no desk, cut-ups or calibration.
  'analyst@trenchwork.test': ['This Week', 'Film Library', 'Readiness Grid', 'Depth Chart', 'Position Battle', 'Roster', 'Mail settings'],
  'player@trenchwork.test': ['This Week', 'Study Queue', 'Progress', 'Mail settings'],
};

test.each(Object.entries(EXPECTED_NAV))('%s signs in and sees only the navigation of the role', async (email, expected) => {
  const page = await h.newPage(email.startsWith('player') ? { width: 390, height: 844 } : {});
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('console', (m) => (m.type() === 'error' ? errors.push(m.text()) : undefined));
  if (email.startsWith('player')) {
    // On a phone the navigation sits in a drawer.
    await page.goto('/sign-in');
    await page.getByLabel('E-mail address').fill(email);
    await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD_FOR_TESTS);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('button', { name: 'Open navigation' }).click();
  } else {
    await signIn(page, email);
  }
  const labels = await navLabels(page);
  expect(labels.at(-1)).toBe(DEV_MAILBOX);
  expect(labels.slice(0, -1)).toEqual(expected);
  // The strict content security policy must not have blocked anything.
  expect(errors.filter((e) => /Content Security Policy|Refused to/i.test(e))).toEqual([]);
  await page.context().close();
});

test('a player who opens the roster address is kept out of it', async () => {
  const page = await h.newPage({ width: 390, height: 844 });
  await page.goto('/sign-in');
  await page.getByLabel('E-mail address').fill('player@trenchwork.test');
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD_FOR_TESTS);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.pathname === '/');
  await page.goto('/roster');
  await page.waitForLoadState('networkidle');
  expect(new URL(page.url()).pathname).not.toBe('/roster');
  await page.context().close();
});

test('the admin adds a player through the roster form and the API has him', async () => {
  const page = await h.newPage();
  await signIn(page, 'admin@trenchwork.test');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Roster' }).click();
  await page.getByRole('table', { name: 'Roster' }).waitFor();
  await page.getByRole('button', { name: 'Add player' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Name').fill('Odell Brackwater');
  await dialog.getByLabel('Jersey').fill('59');
  await dialog.getByLabel('Positions').click();
  await page.getByRole('option', { name: 'C', exact: true }).click();
  await page.getByRole('option', { name: 'LG', exact: true }).click();
  await page.keyboard.press('Escape');
  await dialog.getByLabel('Class').click();
  await page.getByRole('option', { name: /Sophomore|So/ }).first().click();
  await dialog.getByLabel('Height').fill('6-2');
  await dialog.getByLabel('Weight (lb)').fill('268');
  await dialog.getByRole('button', { name: 'Add to roster' }).click();
  await dialog.waitFor({ state: 'detached' });
  await page.getByRole('table', { name: 'Roster' }).getByText('Odell Brackwater').waitFor();

  const stored = await h.t.ctx.db
    .selectFrom('players')
    .innerJoin('roster_entries', 'roster_entries.player_id', 'players.id')
    .select(['players.name', 'roster_entries.jersey', 'roster_entries.positions', 'roster_entries.class_year', 'roster_entries.height_in', 'roster_entries.weight_lb'])
    .where('players.team_id', '=', teamId)
    .where('players.name', '=', 'Odell Brackwater')
    .executeTakeFirstOrThrow();
  expect(stored).toEqual({ name: 'Odell Brackwater', jersey: 59, positions: expect.arrayContaining(['C', 'LG']), class_year: 'So', height_in: 74, weight_lb: 268 });
  await page.context().close();
});

test('a duplicate jersey is refused on the form, and nothing is added', async () => {
  const page = await h.newPage();
  await signIn(page, 'coordinator@trenchwork.test');
  await page.goto('/roster');
  await page.getByRole('table', { name: 'Roster' }).waitFor();
  await page.getByRole('button', { name: 'Add player' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Name').fill('Second Seventy-Two');
  await dialog.getByLabel('Jersey').fill('72');
  await dialog.getByLabel('Positions').click();
  await page.getByRole('option', { name: 'RT', exact: true }).click();
  await page.keyboard.press('Escape');
  await dialog.getByLabel('Class').click();
  await page.getByRole('option', { name: /Freshman|Fr/ }).first().click();
  await dialog.getByRole('button', { name: 'Add to roster' }).click();
  await dialog.getByText(/72 is taken|already on/i).first().waitFor();
  const count = await h.t.ctx.db.selectFrom('players').select('id').where('name', '=', 'Second Seventy-Two').execute();
  expect(count).toHaveLength(0);
  await page.context().close();
});
