import type { ApiClient } from '../support/api-client';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * The roster API: list contract, add / edit with field-named errors, all-or-nothing CSV import with
 * row and column errors, jersey rules (unique per season, swaps inside one file), export that
 * round-trips through import, and who may do what.
 */
const HEADER = 'name,jersey,positions,class,redshirt,height,weight,status';

let t: TestApp;

beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t?.close();
});

async function signedIn(email: string): Promise<ApiClient> {
  const client = t.client();
  const res = await client.login(email, TEST_PASSWORD);
  expect(res.status).toBe(200);
  return client;
}

/** A fresh team with its admin signed in. */
async function freshTeam(label: string): Promise<{ team: TeamFixture; admin: ApiClient }> {
  const team = await createTeamFixture(t.ctx.db, label);
  return { team, admin: await signedIn(team.accounts.admin.email) };
}

async function rowCounts(teamId: number) {
  const players = await t.ctx.db.selectFrom('players').select('id').where('team_id', '=', teamId).execute();
  const entries = await t.ctx.db
    .selectFrom('roster_entries')
    .innerJoin('players', 'players.id', 'roster_entries.player_id')
    .select('roster_entries.id')
    .where('players.team_id', '=', teamId)
    .execute();
  return { players: players.length, entries: entries.length };
}

type PlayerBody = Record<string, unknown> & { id: number; name: string; jersey: number };

async function roster(client: ApiClient, teamId: number, seasonId?: number): Promise<PlayerBody[]> {
  const res = await client.get(`/api/teams/${teamId}/players${seasonId ? `?seasonId=${seasonId}` : ''}`);
  expect(res.status).toBe(200);
  return res.body.players;
}

const importCsv = (client: ApiClient, teamId: number, csv: string, seasonId?: number) =>
  client.post(`/api/teams/${teamId}/players/import`, { csv, ...(seasonId ? { seasonId } : {}) });

const validPlayer = { name: 'Dane Holloway', jersey: 55, positions: ['RG', 'RT'], classYear: 'So', heightIn: 77, weightLb: 301 };

describe('listing', () => {
  test('GET /api/teams/{id}/players: contract, ordered by jersey, the linked account shown', async () => {
    const team = await createTeamFixture(t.ctx.db, 'List');
    const coach = await signedIn(team.accounts.coach.email);
    const res = await coach.get(`/api/teams/${team.teamId}/players`);
    expect(res.status).toBe(200);
    const base = { classYear: 'Jr', redshirt: false, heightIn: 75, weightLb: 280, status: 'active', seasonId: team.seasonId };
    expect(res.body).toStrictEqual({
      seasonId: team.seasonId,
      players: [
        { id: team.playerIds[0], name: 'Avery Lintel', jersey: 70, positions: ['LT'], ...base, accountEmail: null },
        { id: team.playerIds[1], name: 'Brook Sandor', jersey: 71, positions: ['LG'], ...base, accountEmail: team.accounts.player.email },
        { id: team.playerIds[2], name: 'Casey Morrow', jersey: 72, positions: ['C'], ...base, accountEmail: null },
      ],
    });
  });

  test("another team's season → 404", async () => {
    const { team, admin } = await freshTeam('Seasons');
    const other = await createTeamFixture(t.ctx.db, 'Foreign');
    const res = await admin.get(`/api/teams/${team.teamId}/players?seasonId=${other.seasonId}`);
    expect(res.status).toBe(404);
  });
});

describe('adding and editing', () => {
  test('add a player → 201 with defaults, listed after', async () => {
    const { team, admin } = await freshTeam('Add');
    const res = await admin.post(`/api/teams/${team.teamId}/players`, validPlayer);
    expect(res.status).toBe(201);
    expect(res.body).toStrictEqual({
      id: expect.any(Number),
      ...validPlayer,
      redshirt: false,
      status: 'active',
      seasonId: team.seasonId,
      accountEmail: null,
    });
    const list = await roster(admin, team.teamId);
    expect(list.map((p) => p.jersey)).toEqual([55, 70, 71, 72]);
    // Coordinators edit the roster too.
    const coordinator = await signedIn(team.accounts.coordinator.email);
    expect((await coordinator.post(`/api/teams/${team.teamId}/players`, { ...validPlayer, name: 'Emery Vance', jersey: 56 })).status).toBe(201);
  });

  test('fields outside the allowlist are ignored (no mass assignment)', async () => {
    const { team, admin } = await freshTeam('Mass');
    const other = await createTeamFixture(t.ctx.db, 'Victim');
    const res = await admin.post(`/api/teams/${team.teamId}/players`, { ...validPlayer, id: other.playerIds[0], teamId: other.teamId, accountEmail: 'x@y.test' });
    expect(res.status).toBe(201);
    expect(res.body.id).not.toBe(other.playerIds[0]);
    expect(res.body.accountEmail).toBeNull();
    const row = await t.ctx.db.selectFrom('players').select('team_id').where('id', '=', res.body.id).executeTakeFirstOrThrow();
    expect(row.team_id).toBe(team.teamId);
    expect(await rowCounts(other.teamId)).toEqual({ players: 3, entries: 3 });
  });

  test('a jersey already on the season roster → 409 naming jersey; nothing added', async () => {
    const { team, admin } = await freshTeam('Dup');
    const res = await admin.post(`/api/teams/${team.teamId}/players`, { ...validPlayer, jersey: 71 });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
    expect(res.body.error.fields).toEqual({ jersey: expect.any(String) });
    expect(await rowCounts(team.teamId)).toEqual({ players: 3, entries: 3 });
  });

  test.each([
    ['positions', { positions: ['QB'] }],
    ['positions', { positions: [] }],
    ['positions', { positions: ['LT', 'LT'] }],
    ['classYear', { classYear: 'Senior' }],
    ['jersey', { jersey: 100 }],
    ['jersey', { jersey: -1 }],
    ['jersey', { jersey: 7.5 }],
    ['name', { name: '   ' }],
    ['heightIn', { heightIn: 30 }],
    ['weightLb', { weightLb: 900 }],
    ['status', { status: 'retired' }],
  ])('invalid %s %j → 422 naming that field only', async (field, change) => {
    const { team, admin } = await freshTeam('Invalid');
    const res = await admin.post(`/api/teams/${team.teamId}/players`, { ...validPlayer, ...change });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fields)).toEqual([field]);
    expect(res.body.error.fields[field]).toEqual(expect.any(String));
    expect(await rowCounts(team.teamId)).toEqual({ players: 3, entries: 3 });
  });

  test('PATCH status inactive keeps the player listed; nothing is deleted', async () => {
    const { team, admin } = await freshTeam('Inactive');
    const before = (await roster(admin, team.teamId)).find((p) => p.id === team.playerIds[2])!;
    expect(before.status).toBe('active');
    const res = await admin.patch(`/api/teams/${team.teamId}/players/${team.playerIds[2]}`, { status: 'inactive' });
    expect(res.status).toBe(200);
    expect(res.body).toStrictEqual({ ...before, status: 'inactive' });
    const list = await roster(admin, team.teamId);
    expect(list).toHaveLength(3);
    expect(list.find((p) => p.id === team.playerIds[2])!.status).toBe('inactive');
    expect(await rowCounts(team.teamId)).toEqual({ players: 3, entries: 3 });
  });

  test('PATCH changes only the fields it sends', async () => {
    const { team, admin } = await freshTeam('PatchOne');
    await t.ctx.db.updateTable('roster_entries').set({ status: 'injured', redshirt: true }).where('player_id', '=', team.playerIds[0]).execute();
    const before = (await roster(admin, team.teamId)).find((p) => p.id === team.playerIds[0])!;
    expect(before).toMatchObject({ heightIn: 75, weightLb: 280, redshirt: true, status: 'injured' });
    const renamed = await admin.patch(`/api/teams/${team.teamId}/players/${team.playerIds[0]}`, { name: 'Avery Lintel-Shaw' });
    expect(renamed.status).toBe(200);
    // A rename must not reset height, weight, redshirt or status to their defaults.
    expect(renamed.body).toStrictEqual({ ...before, name: 'Avery Lintel-Shaw' });
    const jersey = await admin.patch(`/api/teams/${team.teamId}/players/${team.playerIds[0]}`, { jersey: 60 });
    expect(jersey.body).toStrictEqual({ ...before, name: 'Avery Lintel-Shaw', jersey: 60 });
  });

  test('PATCH to a taken jersey → 409; invalid → 422; a player of another team through this team → 404', async () => {
    const { team, admin } = await freshTeam('Patch');
    const other = await createTeamFixture(t.ctx.db, 'Patched');
    const taken = await admin.patch(`/api/teams/${team.teamId}/players/${team.playerIds[0]}`, { jersey: 72 });
    expect(taken.status).toBe(409);
    expect(taken.body.error.fields).toEqual({ jersey: expect.any(String) });
    const invalid = await admin.patch(`/api/teams/${team.teamId}/players/${team.playerIds[0]}`, { positions: ['WR'] });
    expect(invalid.status).toBe(422);
    expect(Object.keys(invalid.body.error.fields)).toEqual(['positions']);
    const foreign = await admin.patch(`/api/teams/${team.teamId}/players/${other.playerIds[0]}`, { name: 'Taken Over' });
    expect(foreign.status).toBe(404);
    const untouched = await t.ctx.db.selectFrom('players').select('name').where('id', '=', other.playerIds[0]).executeTakeFirstOrThrow();
    expect(untouched.name).toBe('Avery Lintel');
  });
});

describe('CSV import', () => {
  test('happy path: new rows added, a row naming a roster player updates him', async () => {
    const { team, admin } = await freshTeam('Import');
    const csv = [
      HEADER,
      'Dane Holloway,55,RG RT,So,no,6-5,301,active',
      'Emery Vance,64,C/LG,Freshman,yes,76,290,injured',
      'casey morrow,72,C,Sr,no,6-3,285,active',
    ].join('\n');
    const res = await importCsv(admin, team.teamId, csv);
    expect(res.status).toBe(200);
    expect(res.body).toStrictEqual({ imported: 2, updated: 1 });
    const list = await roster(admin, team.teamId);
    expect(list).toHaveLength(5);
    expect(list.find((p) => p.jersey === 55)).toMatchObject({ name: 'Dane Holloway', positions: ['RG', 'RT'], classYear: 'So', heightIn: 77, weightLb: 301, redshirt: false });
    expect(list.find((p) => p.jersey === 64)).toMatchObject({ name: 'Emery Vance', positions: ['C', 'LG'], classYear: 'Fr', heightIn: 76, redshirt: true, status: 'injured' });
    expect(list.find((p) => p.id === team.playerIds[2])).toMatchObject({ classYear: 'Sr', heightIn: 75, weightLb: 285 });
  });

  test('several bad rows → 422 listing each row number and column; nothing imported', async () => {
    const { team, admin } = await freshTeam('BadCsv');
    const before = await rowCounts(team.teamId);
    const csv = [
      HEADER, //                                 row 1
      'Good Row,50,LG,Jr,no,6-4,300,active', //   row 2: fine (must not be imported either)
      'Bad Jersey,abc,LG,Jr,no,,,', //            row 3: jersey
      'Bad Position,51,QB,So,no,,,', //           row 4: positions
      'Bad Class,52,C,Xx,no,,,', //               row 5: class
      'Same Number,50,RT,Fr,no,,,', //            row 6: jersey (also on row 2)
      'Two Problems,120,XX,Jr,no,,,', //          row 7: jersey and positions
      ',53,LT,Jr,no,,,', //                       row 8: name
      'Bad Height,54,LT,Jr,no,tall,,', //         row 9: height
      'Bad Weight,56,LT,Jr,no,,heavy,', //        row 10: weight
      'Bad Redshirt,57,LT,Jr,maybe,,,', //        row 11: redshirt
      'Bad Status,58,LT,Jr,no,,,retired', //      row 12: status
      'Casey Morrow,72,C,Sr,no,6-3,285,active', // row 13: fine (an update that must not happen)
    ].join('\n');
    const res = await importCsv(admin, team.teamId, csv);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.message).toMatch(/^Nothing was imported: 11 problems found/);
    const rows = res.body.error.rows as { row: number; field: string; message: string }[];
    expect(rows.map((r) => `${r.row}:${r.field}`).sort()).toEqual(
      ['3:jersey', '4:positions', '5:class', '6:jersey', '7:jersey', '7:positions', '8:name', '9:height', '10:weight', '11:redshirt', '12:status'].sort(),
    );
    for (const r of rows) expect(r.message.length).toBeGreaterThan(5);
    expect(rows.find((r) => r.row === 6)!.message).toContain('row 2');
    expect(await rowCounts(team.teamId)).toEqual(before);
    const list = await roster(admin, team.teamId);
    expect(list.map((p) => p.name)).toEqual(['Avery Lintel', 'Brook Sandor', 'Casey Morrow']);
    expect(list.find((p) => p.id === team.playerIds[2])!.classYear).toBe('Jr');
  });

  test("a jersey held by a roster player the file does not mention → 422 on that row; nothing imported", async () => {
    const { team, admin } = await freshTeam('Clash');
    const csv = [HEADER, 'Dane Holloway,55,RG,So,no,,,', 'Emery Vance,70,LT,Fr,no,,,'].join('\n');
    const res = await importCsv(admin, team.teamId, csv);
    expect(res.status).toBe(422);
    expect(res.body.error.rows).toEqual([{ row: 3, field: 'jersey', message: expect.stringContaining('Avery Lintel') }]);
    expect(await rowCounts(team.teamId)).toEqual({ players: 3, entries: 3 });
  });

  test('two players swap jerseys in one file', async () => {
    const { team, admin } = await freshTeam('Swap');
    const csv = [HEADER, 'Avery Lintel,71,LT,Jr,no,6-3,280,active', 'Brook Sandor,70,LG,Jr,no,6-3,280,active'].join('\n');
    const res = await importCsv(admin, team.teamId, csv);
    expect(res.status).toBe(200);
    expect(res.body).toStrictEqual({ imported: 0, updated: 2 });
    const list = await roster(admin, team.teamId);
    expect(list.map((p) => [p.id, p.jersey])).toEqual([
      [team.playerIds[1], 70],
      [team.playerIds[0], 71],
      [team.playerIds[2], 72],
    ]);
  });

  test('a file without the optional columns keeps what the roster knows about matched players', async () => {
    const { team, admin } = await freshTeam('Partial');
    // Set directly, so this test does not depend on PATCH.
    await t.ctx.db.updateTable('roster_entries').set({ status: 'injured', redshirt: true }).where('player_id', '=', team.playerIds[0]).execute();
    const before = (await roster(admin, team.teamId)).find((p) => p.id === team.playerIds[0])!;
    const res = await importCsv(admin, team.teamId, ['name,jersey,positions,class', 'Avery Lintel,70,LT LG,Jr'].join('\n'));
    expect(res.status).toBe(200);
    const after = (await roster(admin, team.teamId)).find((p) => p.id === team.playerIds[0])!;
    expect(after.positions).toEqual(['LT', 'LG']);
    // Height, weight, redshirt and status were not in the file: they must not be wiped or reset.
    expect({ heightIn: after.heightIn, weightLb: after.weightLb, redshirt: after.redshirt, status: after.status }).toEqual({
      heightIn: before.heightIn,
      weightLb: before.weightLb,
      redshirt: true,
      status: 'injured',
    });
  });

  test.each([
    ['an unknown column', 'name,jersey,positions,class,shoe\nDane Holloway,55,RG,So,12', [{ row: 1, field: 'shoe' }]],
    ['a missing required column', 'name,jersey,class\nDane Holloway,55,So', [{ row: 1, field: 'positions' }]],
    ['a header and no players', HEADER, [{ row: 2, field: 'file' }]],
    ['an empty file', '', [{ row: 1, field: 'file' }]],
    ['broken quoting', `${HEADER}\n"Dane Holloway,55,RG,So,no,,,`, [{ row: expect.any(Number), field: 'file' }]],
  ])('%s → 422 with the row named', async (_label, csv, expected) => {
    const { team, admin } = await freshTeam('Shape');
    const res = await importCsv(admin, team.teamId, csv as string);
    expect(res.status).toBe(422);
    expect(res.body.error.rows).toEqual((expected as object[]).map((e) => ({ ...e, message: expect.any(String) })));
    expect(await rowCounts(team.teamId)).toEqual({ players: 3, entries: 3 });
  });
});

describe('CSV export', () => {
  test('export → import into an empty season gives the same roster; re-import into the same season changes nothing', async () => {
    const { team, admin } = await freshTeam('Export');
    const extra = [
      { name: 'Dane "Tank" Holloway', jersey: 55, positions: ['RG', 'RT'], classYear: 'So', redshirt: true, heightIn: 77, weightLb: 301, status: 'injured' },
      { name: 'Ellis Marsh, Jr.', jersey: 9, positions: ['TE'], classYear: 'Gr', heightIn: null, weightLb: null, status: 'inactive' },
      { name: 'Fenn Okafor-Reyes', jersey: 0, positions: ['C', 'LG', 'RG'], classYear: 'Fr', heightIn: 72, weightLb: 255 },
    ];
    for (const p of extra) expect((await admin.post(`/api/teams/${team.teamId}/players`, p)).status).toBe(201);
    const original = await roster(admin, team.teamId);

    const exported = await admin.get(`/api/teams/${team.teamId}/players/export.csv`);
    expect(exported.status).toBe(200);
    expect(exported.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(exported.headers['content-disposition']).toBe('attachment; filename="roster-2026.csv"');
    const csv = exported.text;
    expect(csv.split('\n')[0]).toBe(HEADER);
    expect(csv.trim().split('\n')).toHaveLength(1 + original.length);

    const season = await admin.post(`/api/teams/${team.teamId}/seasons`, { name: '2027', startsOn: '2027-08-01', endsOn: '2027-12-15' });
    expect(season.status).toBe(201);
    const into = await importCsv(admin, team.teamId, csv, season.body.id);
    expect(into.status).toBe(200);
    expect(into.body).toStrictEqual({ imported: original.length, updated: 0 });
    const facts = (players: PlayerBody[]) => players.map(({ id: _id, seasonId: _s, accountEmail: _a, ...rest }) => rest);
    expect(facts(await roster(admin, team.teamId, season.body.id))).toEqual(facts(original));

    const same = await importCsv(admin, team.teamId, csv);
    expect(same.status).toBe(200);
    expect(same.body).toStrictEqual({ imported: 0, updated: original.length });
    expect(await roster(admin, team.teamId)).toEqual(original);
  });
});

describe('who may do what', () => {
  test("another team's admin → 403 on every roster route", async () => {
    const team = await createTeamFixture(t.ctx.db, 'Owner');
    const intruder = await freshTeam('Intruder');
    const base = `/api/teams/${team.teamId}/players`;
    const results = [
      await intruder.admin.get(base),
      await intruder.admin.get(`${base}/export.csv`),
      await intruder.admin.post(base, validPlayer),
      await intruder.admin.patch(`${base}/${team.playerIds[0]}`, { status: 'inactive' }),
      await importCsv(intruder.admin, team.teamId, `${HEADER}\nDane Holloway,55,RG,So,no,,,`),
    ];
    expect(results.map((r) => r.status)).toEqual([403, 403, 403, 403, 403]);
    for (const r of results) expect(r.body.error.code).toBe('forbidden');
    expect(await rowCounts(team.teamId)).toEqual({ players: 3, entries: 3 });
  });

  test('a coach can list and export but not add, edit or import; a player cannot list', async () => {
    const team = await createTeamFixture(t.ctx.db, 'Roles');
    const coach = await signedIn(team.accounts.coach.email);
    const base = `/api/teams/${team.teamId}/players`;
    expect((await coach.get(base)).status).toBe(200);
    expect((await coach.get(`${base}/export.csv`)).status).toBe(200);
    expect((await coach.post(base, validPlayer)).status).toBe(403);
    expect((await coach.patch(`${base}/${team.playerIds[0]}`, { status: 'inactive' })).status).toBe(403);
    expect((await importCsv(coach, team.teamId, `${HEADER}\nDane Holloway,55,RG,So,no,,,`)).status).toBe(403);
    const player = await signedIn(team.accounts.player.email);
    expect((await player.get(base)).status).toBe(403);
    expect(await rowCounts(team.teamId)).toEqual({ players: 3, entries: 3 });
  });
});
