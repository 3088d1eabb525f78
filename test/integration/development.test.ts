import type { Kysely } from 'kysely';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { startTestApp, type TestApp } from '../support/test-app';
import type { ApiClient } from '../support/api-client';

/**
 * Development numbers through the API, on grades built by hand so every expected value can be
 * worked out here: per-session rates and Wilson intervals, the weekly trend, splits, the comparison
 * of two guards, kappa between two graders (the Wikipedia "Cohen's kappa" worked example, from
 * memory: 20 yes/yes, 5 yes/no, 10 no/yes, 15 no/no → κ = 0.4), and the readiness matrix.
 */
let t: TestApp;
let team: TeamFixture;
let coach: ApiClient;
let A: number; // LT, "Avery Lintel"
let B: number; // LG, the player account's lineman
let C: number;
let concept: { power: number; zone: number };
let front: { bear: number; over: number };

type Db = Kysely<any>;
async function session(db: Db, date: string, kind = 'game'): Promise<number> {
  return (await db.insertInto('film_sessions').values({ team_id: team.teamId, season_id: team.seasonId, kind, title: `${kind} ${date}`, date, opponent: kind === 'game' ? 'Otter Bend' : null }).returning('id').executeTakeFirstOrThrow()).id;
}
type SnapTags = { concept_id?: number; front_id?: number; down?: number; distance?: number; hash?: 'left' | 'middle' | 'right'; quarter?: number; personnel?: string | null };
/**
 * Inserts `plus` plus and `minus` minus grades for a player in a session, one snap each, the snaps
 * carrying `tags` and the grades the position played (`position`, LT unless given).
 */
async function grades(db: Db, sessionId: number, playerId: number, plus: number, minus: number, { position = 'LT', ...tags }: SnapTags & { position?: string } = {}, grader = team.accounts.coach.userId) {
  const start = ((await db.selectFrom('snaps').select((eb) => eb.fn.max('order').as('m')).where('session_id', '=', sessionId).executeTakeFirst()) as { m: number | null })?.m ?? 0;
  for (let i = 0; i < plus + minus; i += 1) {
    const snap = await db.insertInto('snaps').values({ session_id: sessionId, order: Number(start) + i + 1, ...tags }).returning('id').executeTakeFirstOrThrow();
    const good = i < plus;
    await db
      .insertInto('grades')
      .values({ snap_id: snap.id, player_id: playerId, grader_id: grader, scheme_version: 1, position, assignment: 'right', footwork: good ? 'plus' : 'minus', hands: 'plus', pad_level: 'plus', effort: 'plus', result: good ? 'plus' : 'minus' })
      .execute();
  }
}

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeamFixture(t.ctx.db, 'Dev');
  [A, B, C] = team.playerIds as [number, number, number];
  coach = t.client();
  expect((await coach.login(team.accounts.coach.email, TEST_PASSWORD)).status).toBe(200);
  const item = async (kind: string, name: string) => (await t.ctx.db.insertInto('tag_list_items').values({ team_id: team.teamId, kind, name }).returning('id').executeTakeFirstOrThrow()).id;
  concept = { power: await item('concept', 'power'), zone: await item('concept', 'inside zone') };
  front = { bear: await item('front', 'bear'), over: await item('front', 'over') };
  const db = t.ctx.db;
  // Player A over five Fridays (Mondays 2026-08-31 … 2026-09-28 start the weeks):
  //   week 1: 6/10, week 2: 7/10, week 3: 7/10, week 4: 8/10, week 5: 9/10 — 37 of 50.
  const plusByWeek = [6, 7, 7, 8, 9];
  for (const [i, plus] of plusByWeek.entries()) {
    const day = String(4 + 7 * i).padStart(2, '0');
    const date = i < 4 ? `2026-09-${day}` : '2026-10-02';
    const id = await session(db, date);
    // Power vs bear for the first 5 snaps of each game, inside zone vs over for the rest.
    // Power: always 5 of 5 plus; zone: plus − 5 = 1, 2, 2, 3, 4 of 5 in games 0…4.
    // Hash: power from the middle; zone from the left in games 0, 2, 4 and the right in 1, 3.
    // Quarter: games 0–2 power in Q1, zone in Q2; games 3–4 power in Q3, zone in Q4.
    // Personnel: 11 in games 0–1, 12 in games 2–3, not tagged in game 4 (the whole game each).
    // Position played: LT, except the zone snaps of games 3–4, played at LG.
    const powerPlus = Math.min(plus, 5);
    const early = i < 3;
    const personnel = i < 2 ? '11' : i < 4 ? '12' : null;
    await grades(db, id, A, powerPlus, 5 - powerPlus, { concept_id: concept.power, front_id: front.bear, down: 1, distance: 10, hash: 'middle', quarter: early ? 1 : 3, personnel });
    await grades(db, id, A, plus - powerPlus, 5 - (plus - powerPlus), {
      concept_id: concept.zone, front_id: front.over, down: 3, distance: 2,
      hash: i % 2 === 0 ? 'left' : 'right', quarter: early ? 2 : 4, personnel, position: i >= 3 ? 'LG' : 'LT',
    });
  }
  // Player B: 40 of 80 in one practice; player C: 2 of 3 (too few to compare).
  await grades(db, await session(db, '2026-09-29', 'practice'), B, 40, 40, { concept_id: concept.power, front_id: front.bear });
  await grades(db, await session(db, '2026-09-30', 'practice'), C, 2, 1);
}, 60_000);

afterAll(async () => {
  await t?.close();
});

test('GET /api/players/{id}/development: sessions with Wilson intervals, overall, components, trend', async () => {
  const res = await coach.get(`/api/players/${A}/development`);
  expect(res.status).toBe(200);
  const body = res.body;
  expect(body.sessions.map((s: { snaps: number; plus: number }) => [s.snaps, s.plus])).toEqual([[10, 6], [10, 7], [10, 7], [10, 8], [10, 9]]);
  // Wilson 95 % for 6/10 (Newcombe 1998's method; value computed by shared/stats, which is checked
  // against the paper's examples): [0.3127, 0.8318].
  expect(body.sessions[0].rate).toBe(0.6);
  expect(body.sessions[0].interval[0]).toBeCloseTo(0.3127, 4);
  expect(body.sessions[0].interval[1]).toBeCloseTo(0.8318, 4);
  expect(body.overall).toMatchObject({ snaps: 50, plus: 37, rate: 0.74 });
  // Footwork carried every minus here; hands were always plus.
  expect(body.components.footwork).toMatchObject({ snaps: 50, plus: 37 });
  expect(body.components.hands).toMatchObject({ snaps: 50, plus: 50, rate: 1 });
  // Least squares on weeks 0..4 with rates .6 .7 .7 .8 .9: slope = Σ(x−2)(y−.74)/Σ(x−2)² = 0.7/10 = 0.07.
  expect(body.trend.slopePerWeek).toBeCloseTo(0.07, 10);
  expect(body.trend.reading).toBe('improving');
  // The rolling average over the last three sessions: (7+7+8)/30 at the fourth.
  expect(body.sessions[3].rolling).toBeCloseTo(22 / 30, 10);
});

test('splits: by concept, front, down and distance, hash, quarter, personnel, position played, game or practice; strongest and weakest concepts', async () => {
  const body = (await coach.get(`/api/players/${A}/development`)).body;
  const byName = (list: { value: string; snaps: number; plus: number }[]) => Object.fromEntries(list.map((s) => [s.value, [s.snaps, s.plus]]));
  // Power vs bear: 5 + 5 + 5 + 5 + 5 plus of 25. Inside zone vs over: 1 + 2 + 2 + 3 + 4 = 12 of 25.
  expect(byName(body.splits.concept)).toEqual({ power: [25, 25], 'inside zone': [25, 12] });
  expect(byName(body.splits.front)).toEqual({ bear: [25, 25], over: [25, 12] });
  expect(byName(body.splits.downDistance)).toEqual({ '1st down': [25, 25], '2nd/3rd & short': [25, 12] });
  expect(byName(body.splits.sessionKind)).toEqual({ game: [50, 37] });
  // Hash (tags in beforeAll; zone plus by game 1, 2, 2, 3, 4): middle = the 25 power snaps, 25 plus;
  // left = zone in games 0, 2, 4: 15 snaps, 1 + 2 + 4 = 7 plus; right = zone in games 1, 3: 10 snaps, 2 + 3 = 5 plus.
  expect(byName(body.splits.hash)).toEqual({ middle: [25, 25], left: [15, 7], right: [10, 5] });
  // Quarter: Q1 = power in games 0–2: 15 snaps, 15 plus; Q2 = zone in games 0–2: 15 snaps, 1 + 2 + 2 = 5;
  // Q3 = power in games 3–4: 10 snaps, 10 plus; Q4 = zone in games 3–4: 10 snaps, 3 + 4 = 7. Total 50, 37.
  expect(byName(body.splits.quarter)).toEqual({ '1': [15, 15], '2': [15, 5], '3': [10, 10], '4': [10, 7] });
  // Personnel (whole games): 11 = games 0–1: 20 snaps, 6 + 7 = 13 plus; 12 = games 2–3: 20 snaps,
  // 7 + 8 = 15 plus; game 4 not tagged: 10 snaps, 9 plus. Total 50, 37.
  expect(byName(body.splits.personnel)).toEqual({ '11': [20, 13], '12': [20, 15], untagged: [10, 9] });
  // Position played: LG = zone in games 3–4: 10 snaps, 3 + 4 = 7 plus; LT = the other 40 snaps, 37 − 7 = 30 plus.
  expect(byName(body.splits.position)).toEqual({ LT: [40, 30], LG: [10, 7] });
  expect(body.concepts.strongest[0].value).toBe('power');
  expect(body.concepts.weakest[0].value).toBe('inside zone');
});

test('a player opens his own page only', async () => {
  const player = t.client();
  expect((await player.login(team.accounts.player.email, TEST_PASSWORD)).status).toBe(200);
  expect((await player.get(`/api/players/${B}/development`)).status).toBe(200);
  expect((await player.get(`/api/players/${A}/development`)).status).toBe(403);
});

test('GET /api/comparisons: rates with intervals, the z test, P(A better), and the small-sample warning', async () => {
  const res = await coach.get(`/api/comparisons?players=${A},${B},${C}`);
  expect(res.status).toBe(200);
  expect(res.body.players.map((p: { playerId: number; snaps: number; plus: number }) => [p.playerId, p.snaps, p.plus])).toEqual([[A, 50, 37], [B, 80, 40], [C, 3, 2]]);
  const ab = res.body.pairs.find((p: { a: number; b: number }) => p.a === A && p.b === B);
  // Pooled p = 77/130 = 0.592308; p(1−p) = 0.241479; × (1/50 + 1/80 = 0.0325) = 0.0078481;
  // sqrt = 0.088590; z = (0.74 − 0.50) / 0.088590 = 2.7091 (by hand).
  expect(ab.difference).toBeCloseTo(0.24, 10);
  expect(ab.z).toBeCloseTo(2.7091, 3);
  expect(ab.pValue).toBeLessThan(0.01);
  expect(ab.probabilityABetter).toBeGreaterThan(0.99);
  expect(ab.warning).toBeNull();
  const ac = res.body.pairs.find((p: { a: number; b: number }) => p.a === A && p.b === C);
  expect(ac.warning).toBe('too few snaps to tell');
  expect((await coach.get(`/api/comparisons?players=${A}`)).status).toBe(422);
});

test("GET /api/teams/{id}/agreement: kappa per component with the snaps compared (Wikipedia's worked example)", async () => {
  const db = t.ctx.db;
  const id = await session(db, '2026-10-05', 'practice');
  // Footwork by the coach (a) and the coordinator (b) on 50 snaps of player C:
  // 20 plus/plus, 5 plus/minus, 10 minus/plus, 15 minus/minus. po = 0.7, pe = 0.5·0.6 + 0.5·0.4 = 0.5, κ = 0.4.
  const table: [string, string, number][] = [['plus', 'plus', 20], ['plus', 'minus', 5], ['minus', 'plus', 10], ['minus', 'minus', 15]];
  let order = 1;
  for (const [a, b, n] of table) {
    for (let i = 0; i < n; i += 1) {
      const snap = await db.insertInto('snaps').values({ session_id: id, order: order++ }).returning('id').executeTakeFirstOrThrow();
      for (const [grader, mark] of [[team.accounts.coach.userId, a], [team.accounts.coordinator.userId, b]] as const) {
        await db.insertInto('grades').values({ snap_id: snap.id, player_id: C, grader_id: grader, scheme_version: 1, assignment: 'right', footwork: mark, result: mark }).execute();
      }
    }
  }
  const res = await coach.get(`/api/teams/${team.teamId}/agreement?graderA=${team.accounts.coach.userId}&graderB=${team.accounts.coordinator.userId}`);
  expect(res.status).toBe(200);
  expect(res.body.components.footwork.snaps).toBe(50);
  expect(res.body.components.footwork.kappa).toBeCloseTo(0.4, 10);
  // Assignment: both always "right" → one label only, kappa undefined.
  expect(res.body.components.assignment).toMatchObject({ snaps: 50, kappa: null });
  expect(res.body.components.hands.snaps).toBe(0);
  expect(res.body.disagreements.filter((d: { component: string }) => d.component === 'footwork')).toHaveLength(15);
});

test('the readiness matrix: reps and plus rate per concept × front, with few-rep and low-rate cells marked', async () => {
  const res = await coach.get(`/api/teams/${team.teamId}/readiness`);
  expect(res.status).toBe(200);
  const cell = (c: number, f: number) => res.body.cells.find((x: { conceptId: number; frontId: number }) => x.conceptId === c && x.frontId === f);
  // Power vs bear: A's 25 game snaps (all plus) + B's 80 practice reps (40 plus) = 105 reps, 65 plus.
  expect(cell(concept.power, front.bear)).toMatchObject({ reps: 105, gameReps: 25, practiceReps: 80, plus: 65, fewReps: false, belowWinningGrade: true });
  expect(cell(concept.zone, front.over)).toMatchObject({ reps: 25, plus: 12, belowWinningGrade: true });
  expect(cell(concept.power, front.over)).toMatchObject({ reps: 0, rate: null, fewReps: true, belowWinningGrade: false });
  const player = t.client();
  await player.login(team.accounts.player.email, TEST_PASSWORD);
  expect((await player.get(`/api/teams/${team.teamId}/readiness`)).status).toBe(403);
  const coordinator = t.client();
  await coordinator.login(team.accounts.coordinator.email, TEST_PASSWORD);
  expect((await coordinator.patch(`/api/teams/${team.teamId}/sharing`, { unitWithPlayers: true })).body).toEqual({ gradesWithPlayers: true, unitWithPlayers: true });
  expect((await player.get(`/api/teams/${team.teamId}/readiness`)).status).toBe(200);
});

test('goals and notes: set by a coach, progress against the current rate', async () => {
  const goal = await coach.post(`/api/players/${A}/goals`, { component: 'footwork', target: 0.8, dueOn: '2026-11-01' });
  expect(goal.status).toBe(200);
  await coach.post(`/api/players/${A}/notes`, { body: 'Set feet wider on zone.' });
  const body = (await coach.get(`/api/players/${A}/development`)).body;
  expect(body.goals[0]).toMatchObject({ component: 'footwork', target: 0.8, current: 0.74, met: false });
  expect(body.notes[0]).toMatchObject({ body: 'Set feet wider on zone.' });
});
