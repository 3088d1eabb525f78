import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { waitForMail } from '../support/mailbox';
import { startTestApp, type TestApp } from '../support/test-app';
import type { ApiClient } from '../support/api-client';

/**
 * Grading through the API on a real database: the PUT contract with versions, concurrent saves,
 * the final-grade rule, hand-worked grade sheets, locks, scheme versions, and who may do what.
 */
let t: TestApp;
let team: TeamFixture;
let coach: ApiClient;
let coordinator: ApiClient;
let sessionId: number;
let snapIds: number[];
let LT: number;
let LG: number;
let C: number;

async function signedIn(email: string): Promise<ApiClient> {
  const client = t.client();
  expect((await client.login(email, TEST_PASSWORD)).status).toBe(200);
  return client;
}

beforeAll(async () => {
  t = await startTestApp();
  await t.startWorker();
  team = await createTeamFixture(t.ctx.db, 'Grades');
  [LT, LG, C] = team.playerIds as [number, number, number];
  coach = await signedIn(team.accounts.coach.email);
  coordinator = await signedIn(team.accounts.coordinator.email);
  const session = await t.ctx.db
    .insertInto('film_sessions')
    .values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: 'Week 4 vs Marrow Flats', date: '2026-09-25', opponent: 'Marrow Flats' })
    .returning('id')
    .executeTakeFirstOrThrow();
  sessionId = session.id;
  snapIds = [];
  for (let order = 1; order <= 4; order += 1) snapIds.push((await t.ctx.db.insertInto('snaps').values({ session_id: sessionId, order }).returning('id').executeTakeFirstOrThrow()).id);
  // The depth chart's starters fill the desk: LT, LG and C here.
  const chart = await coordinator.put(`/api/teams/${team.teamId}/depth-chart`, { positions: { LT: [LT], LG: [LG], C: [C] }, reason: 'opening week' });
  expect(chart.status).toBe(200);
}, 60_000);

afterAll(async () => {
  await t?.close();
});

const allPlus = { assignment: 'right', footwork: 'plus', hands: 'plus', padLevel: 'plus', effort: 'plus' };
const put = (client: ApiClient, snap: number, player: number, body: object) => client.put(`/api/snaps/${snap}/grades/${player}`, body);

describe('PUT /api/snaps/{snapId}/grades/{playerId}', () => {
  test('a new grade is version 1 with its result; an edit from that version makes version 2', async () => {
    const first = await put(coach, snapIds[0]!, LT, { ...allPlus, knockdowns: 1 });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ snapId: snapIds[0], playerId: LT, graderId: team.accounts.coach.userId, version: 1, result: 'plus', knockdowns: 1, schemeVersion: 1 });
    const edit = await put(coach, snapIds[0]!, LT, { ...allPlus, hands: 'minus', knockdowns: 1, version: 1 });
    expect(edit.status).toBe(200);
    expect(edit.body).toMatchObject({ version: 2, result: 'minus', hands: 'minus' });
  });

  test('a stale version gets 409 with the current grade, and nothing is overwritten', async () => {
    const stale = await put(coach, snapIds[0]!, LT, { ...allPlus, version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
    expect(stale.body.error.current).toMatchObject({ version: 2, hands: 'minus' });
    const again = await put(coach, snapIds[0]!, LT, { ...allPlus });
    expect(again.status).toBe(409);
  });

  test('two sessions of the same coach saving the same cell from one version: one wins, the other gets 409', async () => {
    const laptop = await signedIn(team.accounts.coach.email);
    const tablet = await signedIn(team.accounts.coach.email);
    const base = await put(laptop, snapIds[1]!, LG, allPlus);
    expect(base.body.version).toBe(1);
    const P = 8;
    const results = await Promise.all(Array.from({ length: P }, (_, i) => put(i % 2 ? tablet : laptop, snapIds[1]!, LG, { ...allPlus, knockdowns: i, version: 1 })));
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([200, ...Array(P - 1).fill(409)]);
    const winner = results.find((r) => r.status === 200)!;
    const stored = await t.ctx.db.selectFrom('grades').select(['version', 'knockdowns']).where('snap_id', '=', snapIds[1]!).where('player_id', '=', LG).executeTakeFirstOrThrow();
    expect(stored).toEqual({ version: 2, knockdowns: winner.body.knockdowns });
  });

  test('bad marks get field errors: a reason without a miss, an unknown penalty, a negative count', async () => {
    const res = await put(coach, snapIds[2]!, C, { assignment: 'right', missedReason: 'communication', penalties: [{ type: 'juggling' }], knockdowns: -1 });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['knockdowns']);
    const res2 = await put(coach, snapIds[2]!, C, { assignment: 'right', missedReason: 'communication', penalties: [{ type: 'juggling' }] });
    expect(res2.status).toBe(422);
    expect(Object.keys(res2.body.error.fields).sort()).toEqual(['missedReason', 'penalties']);
  });

  test('analysts and players cannot write grades', async () => {
    const analyst = await signedIn(team.accounts.analyst.email);
    const player = await signedIn(team.accounts.player.email);
    expect((await put(analyst, snapIds[3]!, C, allPlus)).status).toBe(403);
    expect((await put(player, snapIds[3]!, LG, allPlus)).status).toBe(403);
  });
});

describe('the grade sheet from hand-worked grades', () => {
  let sheetSession: number;
  let snaps: number[];

  beforeAll(async () => {
    const session = await t.ctx.db
      .insertInto('film_sessions')
      .values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: 'Week 5', date: '2026-10-02', opponent: 'Quarry Point' })
      .returning('id')
      .executeTakeFirstOrThrow();
    sheetSession = session.id;
    snaps = [];
    for (let order = 1; order <= 4; order += 1) snaps.push((await t.ctx.db.insertInto('snaps').values({ session_id: sheetSession, order }).returning('id').executeTakeFirstOrThrow()).id);
    // The coach's grades of LT on four snaps:
    //   1: all plus                                  → plus
    //   2: hands minus, 1 knockdown                   → minus
    //   3: missed (wrong call), footwork not graded   → minus
    //   4: all plus, effort loaf, 1 pressure allowed  → minus (a loaf is never plus)
    await put(coach, snaps[0]!, LT, allPlus);
    await put(coach, snaps[1]!, LT, { ...allPlus, hands: 'minus', knockdowns: 1 });
    await put(coach, snaps[2]!, LT, { assignment: 'missed', missedReason: 'wrong call', hands: 'plus', padLevel: 'minus', effort: 'plus', note: 'Check the call with the center.' });
    await put(coach, snaps[3]!, LT, { ...allPlus, effort: 'loaf', pressuresAllowed: 1, penalties: [{ type: 'holding' }] });
    // LG graded plus by the coach on snap 1, minus by the coordinator (the designated grader): the
    // coordinator's grade is final. On snap 2 only the coach graded LG plus: his grade is final.
    await put(coach, snaps[0]!, LG, allPlus);
    await put(coordinator, snaps[0]!, LG, { ...allPlus, padLevel: 'minus' });
    await put(coach, snaps[1]!, LG, { ...allPlus, sacksAllowed: 0 });
    // C: all plus on snaps 1 and 2 (so snap 1 is minus for the unit through LG, snap 2 through LT).
    await put(coach, snaps[0]!, C, allPlus);
    await put(coach, snaps[1]!, C, allPlus);
  });

  test('per player: snaps, plus, rates per component, counts, reasons and notes', async () => {
    const res = await coach.get(`/api/film-sessions/${sheetSession}/grade-sheet`);
    expect(res.status).toBe(200);
    const lt = res.body.players.find((p: { playerId: number }) => p.playerId === LT);
    // 4 graded snaps, 1 plus → 0.25. Assignment right 3, missed 1 → 0.75. Footwork plus on 1, 2, 4 and not
    // graded on 3 → 3/3. Hands plus 1, 3, 4, minus 2 → 3/4. Pad level plus 1, 2, 4, minus 3 → 3/4.
    // Effort plus 1, 2, 3, loaf 4 → 3/4.
    expect(lt).toMatchObject({
      snaps: 4,
      plus: 1,
      plusRate: 0.25,
      meetsWinningGrade: false,
      components: {
        assignment: { plus: 3, minus: 1, rate: 0.75 },
        footwork: { plus: 3, minus: 0, rate: 1 },
        hands: { plus: 3, minus: 1, rate: 0.75 },
        padLevel: { plus: 3, minus: 1, rate: 0.75 },
        effort: { plus: 3, minus: 1, rate: 0.75 },
      },
      missedAssignments: 1,
      missedByReason: { 'wrong call': 1 },
      knockdowns: 1,
      pressuresAllowed: 1,
      sacksAllowed: 0,
      penalties: 1,
      penaltiesByType: { holding: 1 },
      notes: [{ snapOrder: 3, note: 'Check the call with the center.' }],
    });
    const lg = res.body.players.find((p: { playerId: number }) => p.playerId === LG);
    // Snap 1: the coordinator's minus is final; snap 2: the coach's plus. 2 snaps, 1 plus.
    expect(lg).toMatchObject({ snaps: 2, plus: 1, plusRate: 0.5, components: { padLevel: { plus: 1, minus: 1, rate: 0.5 } } });
    const c = res.body.players.find((p: { playerId: number }) => p.playerId === C);
    expect(c).toMatchObject({ snaps: 2, plus: 2, plusRate: 1, meetsWinningGrade: true });
  });

  test('the unit view: a snap is all-plus only when every lineman on the field graded plus', async () => {
    const res = await coach.get(`/api/film-sessions/${sheetSession}/grade-sheet`);
    const unit = res.body.unit;
    // Snap 1: LG minus (final). Snap 2: LT minus. Snaps 3, 4: only LT graded (C and LG not graded) →
    // they wait until the whole line on the field is graded and count in neither.
    expect(unit.bySnap.map((s: { order: number; allPlus: boolean; counted: boolean }) => [s.order, s.allPlus, s.counted])).toEqual([
      [1, false, true],
      [2, false, true],
      [3, false, false],
      [4, false, false],
    ]);
    expect(unit.bySnap[0].minusPlayerIds).toEqual([LG]);
    expect(unit.bySnap[0].weakestLinkIds).toEqual([LG]);
    expect(unit).toMatchObject({ snaps: 2, allPlus: 0, incomplete: 2, rate: 0 });
  });

  test('a player reads only his own row; with sharing off, nothing', async () => {
    const player = await signedIn(team.accounts.player.email);
    const own = await player.get(`/api/film-sessions/${sheetSession}/grade-sheet`);
    expect(own.status).toBe(200);
    expect(own.body.players.map((p: { playerId: number }) => p.playerId)).toEqual([team.ownPlayerId]);
    expect(own.body.unit.bySnap).toEqual([]);
    await t.ctx.db.updateTable('teams').set({ share_grades_with_players: false }).where('id', '=', team.teamId).execute();
    expect((await player.get(`/api/film-sessions/${sheetSession}/grade-sheet`)).status).toBe(403);
    await t.ctx.db.updateTable('teams').set({ share_grades_with_players: true }).where('id', '=', team.teamId).execute();
  });

  test('CSV export with our columns, and the sheet mailed to the player', async () => {
    const csv = (await coach.agent.get(`/api/film-sessions/${sheetSession}/grade-sheet.csv`)).text;
    const [header, ...rows] = csv.trim().split('\n');
    expect(header).toBe('jersey,player,snaps,plus,plus_pct,winning_grade,assignment_pct,footwork_pct,hands_pct,padLevel_pct,effort_pct,missed_assignments,knockdowns,pressures_allowed,sacks_allowed,penalties');
    expect(rows.find((r) => r.includes('Avery Lintel'))).toBe('70,Avery Lintel,4,1,25.0,not met,75.0,100.0,75.0,75.0,75.0,1,1,1,0,1');
    const mailed = await coach.post(`/api/film-sessions/${sheetSession}/grade-sheet/mail`, { playerId: team.ownPlayerId });
    expect(mailed.status).toBe(202);
    const mail = await waitForMail(team.accounts.player.email, /grade sheet/);
    expect(mail.text).toContain('Snaps graded: 2. Plus: 1 (50 %');
    const noAccount = await coach.post(`/api/film-sessions/${sheetSession}/grade-sheet/mail`, { playerId: LT });
    expect(noAccount.status).toBe(409);
  });
});

describe('progress, locks and scheme versions', () => {
  test('progress counts cells per grader against linemen on the field; lock stops saves; unlock needs a reason', async () => {
    const progress = await coordinator.get(`/api/film-sessions/${sessionId}/grading-progress`);
    expect(progress.status).toBe(200);
    // 4 snaps × 3 starters = 12 expected cells.
    expect(progress.body.expectedCells).toBe(12);
    expect(progress.body.graders.find((g: { graderId: number }) => g.graderId === team.accounts.coach.userId).gradedCells).toBe(2);
    const lock = await coordinator.post(`/api/film-sessions/${sessionId}/grading-lock`, { locked: true });
    expect(lock.body.locked).toBe(true);
    const blocked = await put(coach, snapIds[3]!, C, allPlus);
    expect(blocked.status).toBe(409);
    expect(blocked.body.error.message).toMatch(/locked/);
    expect((await coach.post(`/api/film-sessions/${sessionId}/grading-lock`, { locked: false, reason: 'x' })).status).toBe(403);
    expect((await coordinator.post(`/api/film-sessions/${sessionId}/grading-lock`, { locked: false })).status).toBe(422);
    const unlock = await coordinator.post(`/api/film-sessions/${sessionId}/grading-lock`, { locked: false, reason: 'Regrade snap 4 after the film review' });
    expect(unlock.body.locked).toBe(false);
    expect(unlock.body.lockHistory.map((h: { action: string; reason: string | null }) => [h.action, h.reason])).toEqual([
      ['unlocked', 'Regrade snap 4 after the film review'],
      ['locked', null],
    ]);
    expect((await put(coach, snapIds[3]!, C, allPlus)).status).toBe(200);
  });

  test('a new scheme version: old grades keep their result, new ones use the new rule; extra components need the scheme', async () => {
    const before = (await t.ctx.db.selectFrom('grades').select(['id', 'result', 'scheme_version']).orderBy('id').execute()).map((g) => ({ ...g }));
    const scheme = (await coordinator.get(`/api/teams/${team.teamId}/grading-scheme`)).body;
    const saved = await coordinator.put(`/api/teams/${team.teamId}/grading-scheme`, {
      extraComponents: [{ key: 'finish', label: 'Finish', active: true }],
      missedReasons: scheme.missedReasons,
      penaltyTypes: scheme.penaltyTypes,
      resultRule: { kind: 'points', weights: { assignment: 2, footwork: 1, hands: 1, padLevel: 1, effort: 1 }, missedPenalty: 3, passPoints: 4 },
      winningThreshold: 0.85,
      designatedGraderRole: 'coordinator',
    });
    expect(saved.status).toBe(200);
    expect(saved.body.version).toBe(2);
    const after = await t.ctx.db.selectFrom('grades').select(['id', 'result', 'scheme_version']).orderBy('id').execute();
    expect(after).toEqual(before);
    // Under the points rule hands − alone still passes (2 + 1 − 1 + 1 + 1 = 4).
    const graded = await put(coach, snapIds[2]!, LT, { ...allPlus, hands: 'minus', extra: { finish: 'plus' } });
    expect(graded.status).toBe(200);
    expect(graded.body).toMatchObject({ result: 'plus', schemeVersion: 2, extra: { finish: 'plus' } });
    const unknown = await put(coach, snapIds[2]!, LG, { ...allPlus, extra: { eyes: 'plus' } });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields).toHaveProperty('extra');
  });

  test('retired marks: an old grade can still be edited with them unchanged, but not changed to or added', async () => {
    // LT on snap 3 was graded under version 2 with finish plus. Version 3 retires finish and the
    // "communication" reason; the grade's other marks stay editable.
    const scheme = (await coordinator.get(`/api/teams/${team.teamId}/grading-scheme`)).body;
    const withReason = await put(coach, snapIds[2]!, C, { ...allPlus, assignment: 'missed', missedReason: 'communication', extra: { finish: 'minus' } });
    expect(withReason.status).toBe(200);
    const retired = await coordinator.put(`/api/teams/${team.teamId}/grading-scheme`, {
      ...scheme,
      extraComponents: [{ key: 'finish', label: 'Finish', active: false }],
      missedReasons: scheme.missedReasons.filter((r: string) => r !== 'communication'),
    });
    expect(retired.status).toBe(200);
    const lt = (await coach.get(`/api/snaps/${snapIds[2]}/grades`)).body.grades.find((g: { playerId: number; graderId: number }) => g.playerId === LT && g.graderId === team.accounts.coach.userId);
    const edited = await put(coach, snapIds[2]!, LT, { ...allPlus, padLevel: 'minus', extra: { finish: 'plus' }, version: lt.version });
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({ padLevel: 'minus', extra: { finish: 'plus' } });
    const changed = await put(coach, snapIds[2]!, LT, { ...allPlus, extra: { finish: 'minus' }, version: edited.body.version });
    expect(changed.status).toBe(422);
    expect(changed.body.error.fields).toHaveProperty('extra');
    // The retired reason stays on the grade that has it, and is refused on a grade that does not.
    const c = await put(coach, snapIds[2]!, C, { ...allPlus, assignment: 'missed', missedReason: 'communication', hands: 'minus', extra: { finish: 'minus' }, version: withReason.body.version });
    expect(c.status).toBe(200);
    const fresh = await put(coach, snapIds[3]!, LT, { ...allPlus, assignment: 'missed', missedReason: 'communication' });
    expect(fresh.status).toBe(422);
    expect(fresh.body.error.fields).toHaveProperty('missedReason');
  });

  test('the desk lists starters from the depth chart until a snap records its own linemen', async () => {
    const desk = await coach.get(`/api/film-sessions/${sessionId}/desk`);
    expect(desk.status).toBe(200);
    expect(desk.body.snaps[0].participants).toEqual([
      { playerId: LT, position: 'LT' },
      { playerId: LG, position: 'LG' },
      { playerId: C, position: 'C' },
    ]);
    expect(desk.body.snaps[0].participantsFromDepthChart).toBe(true);
    expect(desk.body.snaps[0].myGrades.map((g: { playerId: number }) => g.playerId)).toEqual([LT]);
    const heavy = await coach.put(`/api/snaps/${snapIds[1]}/participants`, { participants: [{ playerId: LT, position: 'LT' }, { playerId: C, position: 'C' }, { playerId: LG, position: 'TE' }] });
    expect(heavy.status).toBe(200);
    const again = await coach.get(`/api/film-sessions/${sessionId}/desk`);
    expect(again.body.snaps[1]).toMatchObject({ participantsFromDepthChart: false });
    expect(again.body.snaps[1].participants).toHaveLength(3);
    const history = await coordinator.get(`/api/teams/${team.teamId}/depth-chart/history`);
    expect(history.body.changes[0]).toMatchObject({ reason: 'opening week', by: expect.stringContaining('coordinator') });
  });
});

describe('practice reps', () => {
  test('graded practice reps per player by period, concept and front', async () => {
    const practice = await t.ctx.db
      .insertInto('film_sessions')
      .values({ team_id: team.teamId, season_id: team.seasonId, kind: 'practice', title: 'Tuesday', date: '2026-09-29', periods: ['inside run', 'team run'] })
      .returning('id')
      .executeTakeFirstOrThrow();
    const item = async (kind: string, name: string) =>
      (await t.ctx.db.insertInto('tag_list_items').values({ team_id: team.teamId, kind, name }).onConflict((oc) => oc.doNothing()).returning('id').executeTakeFirst())?.id ??
      (await t.ctx.db.selectFrom('tag_list_items').select('id').where('team_id', '=', team.teamId).where('kind', '=', kind).where('name', '=', name).executeTakeFirstOrThrow()).id;
    const power = await item('concept', 'power');
    const zone = await item('concept', 'inside zone');
    const bear = await item('front', 'bear');
    // Three reps for LT: inside run / power / bear (plus), inside run / power / bear (minus), team run / inside zone / no front (plus).
    const reps = [
      { period: 'inside run', concept_id: power, front_id: bear, body: allPlus },
      { period: 'inside run', concept_id: power, front_id: bear, body: { ...allPlus, assignment: 'missed' } },
      { period: 'team run', concept_id: zone, front_id: null, body: allPlus },
    ];
    for (const [i, rep] of reps.entries()) {
      const snap = await t.ctx.db.insertInto('snaps').values({ session_id: practice.id, order: i + 1, period: rep.period, concept_id: rep.concept_id, front_id: rep.front_id }).returning('id').executeTakeFirstOrThrow();
      expect((await put(coach, snap.id, LT, rep.body)).status).toBe(200);
    }
    const res = await coach.get(`/api/teams/${team.teamId}/reps`);
    expect(res.status).toBe(200);
    const lt = res.body.players.find((p: { playerId: number }) => p.playerId === LT);
    expect(lt).toEqual({
      playerId: LT,
      name: 'Avery Lintel',
      total: 3,
      plus: 2,
      byPeriod: { 'inside run': 2, 'team run': 1 },
      byConcept: { power: 2, 'inside zone': 1 },
      byFront: { bear: 2, untagged: 1 },
    });
    // Game snaps are not practice reps.
    expect(res.body.players.find((p: { playerId: number }) => p.playerId === C)).toBeUndefined();
  });
});

describe('what a save stores and answers', () => {
  let gameId: number;
  let onChart: number;
  let listed: number;
  let lockRace: number;
  let bench: number;

  beforeAll(async () => {
    const game = await t.ctx.db
      .insertInto('film_sessions')
      .values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: 'Week 5 vs Marrow Flats', date: '2026-10-02', opponent: 'Marrow Flats' })
      .returning('id')
      .executeTakeFirstOrThrow();
    gameId = game.id;
    [onChart, listed, lockRace] = await Promise.all(
      [1, 2, 3].map(async (order) => (await t.ctx.db.insertInto('snaps').values({ session_id: gameId, order }).returning('id').executeTakeFirstOrThrow()).id),
    ) as [number, number, number];
    // A reserve on the team, on neither the depth chart nor any snap's list.
    bench = (await t.ctx.db.insertInto('players').values({ team_id: team.teamId, name: 'Dale Quarry' }).returning('id').executeTakeFirstOrThrow()).id;
  });

  test('the answer is the stored grade as the snap lists it, grader name included', async () => {
    const saved = await put(coach, onChart, LT, { ...allPlus, knockdowns: 2, note: 'Finished his man' });
    expect(saved.status).toBe(200);
    const listedGrades = await coach.get(`/api/snaps/${onChart}/grades`);
    expect(listedGrades.body.grades).toStrictEqual([saved.body]);
    expect(saved.body.graderName).toBe('Grades coach');
    const edited = await put(coach, onChart, LT, { ...allPlus, knockdowns: 3, note: null, version: 1 });
    expect(edited.status).toBe(200);
    expect((await coach.get(`/api/snaps/${onChart}/grades`)).body.grades).toStrictEqual([edited.body]);
    expect(edited.body).toMatchObject({ version: 2, knockdowns: 3, note: null, id: saved.body.id });
  });

  test("the stored position: the snap's own list first, else the depth chart, else none", async () => {
    const lineup = await coach.put(`/api/snaps/${listed}/participants`, { participants: [{ playerId: LG, position: 'TE' }, { playerId: C, position: 'C' }] });
    expect(lineup.status).toBe(200);
    for (const [snap, player] of [[onChart, LG], [listed, LG], [listed, LT], [onChart, bench]] as const) {
      expect((await put(coach, snap, player, allPlus)).status).toBe(200);
    }
    const stored = await t.ctx.db.selectFrom('grades').select(['snap_id', 'player_id', 'position']).where('snap_id', 'in', [onChart, listed]).orderBy('snap_id').orderBy('player_id').execute();
    expect(stored).toEqual(
      [
        { snap_id: onChart, player_id: LT, position: 'LT' },
        { snap_id: onChart, player_id: LG, position: 'LG' },
        { snap_id: onChart, player_id: bench, position: null },
        { snap_id: listed, player_id: LT, position: 'LT' },
        { snap_id: listed, player_id: LG, position: 'TE' },
      ].sort((a, b) => a.snap_id - b.snap_id || a.player_id - b.player_id),
    );
  });

  test("a player of another team is not found on this team's snap", async () => {
    const other = await createTeamFixture(t.ctx.db, 'Elsewhere');
    const res = await put(coach, onChart, other.playerIds[0]!, allPlus);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('That player was not found.');
  });

  test('a lock committed while a save waits for the session wins: the save answers locked and stores nothing', async () => {
    const pool = t.database.handle.pool;
    const locker = await pool.connect();
    try {
      await locker.query('BEGIN');
      await locker.query('SELECT grading_locked FROM film_sessions WHERE id = $1 FOR UPDATE', [gameId]);
      await locker.query('UPDATE film_sessions SET grading_locked = true WHERE id = $1', [gameId]);
      const saving = put(coach, lockRace, C, allPlus);
      // The save has read the session as unlocked (the lock is not committed) and now waits for its row.
      const deadline = Date.now() + 10_000;
      for (;;) {
        const waiting = await pool.query<{ n: number }>(
          `SELECT count(*)::int AS n FROM pg_stat_activity WHERE datname = current_database() AND wait_event_type = 'Lock' AND query ILIKE '%for share%'`,
        );
        if (waiting.rows[0]!.n > 0) break;
        if (Date.now() > deadline) throw new Error('the save never waited for the session row');
        await new Promise((resolve) => setTimeout(resolve, 20));
      }
      await locker.query('COMMIT');
      const res = await saving;
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('conflict');
      expect(res.body.error.message).toMatch(/locked/);
    } finally {
      await locker.query('ROLLBACK').catch(() => undefined);
      locker.release();
    }
    const stored = await t.ctx.db.selectFrom('grades').select('id').where('snap_id', '=', lockRace).execute();
    expect(stored).toEqual([]);
  });
});
