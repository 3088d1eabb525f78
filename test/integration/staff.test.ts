import { sql } from 'kysely';
import type { ApiClient } from '../support/api-client';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * Staff management: the member list, role changes that take effect on the very next request,
 * the last-admin rule (also under concurrent demotions), and deactivation that ends access and
 * sessions at once while keeping the membership row.
 */
let t: TestApp;

beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t?.close();
});

async function signedIn(email: string): Promise<ApiClient> {
  const client = t.client();
  expect((await client.login(email, TEST_PASSWORD)).status).toBe(200);
  return client;
}

async function membershipId(team: TeamFixture, userId: number): Promise<number> {
  const row = await t.ctx.db.selectFrom('memberships').select('id').where('team_id', '=', team.teamId).where('user_id', '=', userId).executeTakeFirstOrThrow();
  return row.id;
}

async function sessionsOf(userId: number): Promise<number> {
  const res = await sql<{ n: number }>`select count(*)::int as n from session where sess->'passport'->>'user' = ${String(userId)}`.execute(t.ctx.db);
  return res.rows[0]!.n;
}

async function activeAdmins(teamId: number): Promise<number> {
  const rows = await t.ctx.db.selectFrom('memberships').select('id').where('team_id', '=', teamId).where('role', '=', 'admin').where('active', '=', true).execute();
  return rows.length;
}

const memberPath = (team: TeamFixture, id: number) => `/api/teams/${team.teamId}/members/${id}`;

test('GET /api/teams/{id}/staff: every member with role and state, and pending invitations', async () => {
  const team = await createTeamFixture(t.ctx.db, 'Staff');
  const admin = await signedIn(team.accounts.admin.email);
  await t.ctx.db
    .insertInto('invitations')
    .values({ team_id: team.teamId, email: 'pending@staff.test', role: 'analyst', token_hash: 's'.repeat(64), invited_by: team.accounts.admin.userId, expires_at: new Date(Date.now() + 3_600_000) })
    .execute();
  const res = await admin.get(`/api/teams/${team.teamId}/staff`);
  expect(res.status).toBe(200);
  const roles = ['admin', 'analyst', 'coach', 'coordinator', 'player'] as const; // ordered by name: "Staff <role>"
  const expected = [];
  for (const role of roles) {
    expected.push({
      membershipId: await membershipId(team, team.accounts[role].userId),
      userId: team.accounts[role].userId,
      name: `Staff ${role}`,
      email: team.accounts[role].email,
      role,
      playerId: role === 'player' ? team.ownPlayerId : null,
      active: true,
      joinedAt: expect.stringMatching(/^\d{4}-\d\d-\d\dT/),
    });
  }
  expect(res.body).toStrictEqual({
    members: expected,
    invitations: [
      {
        id: expect.any(Number),
        email: 'pending@staff.test',
        role: 'analyst',
        playerId: null,
        invitedBy: 'Staff admin',
        createdAt: expect.any(String),
        expiresAt: expect.any(String),
        lastSentAt: expect.any(String),
      },
    ],
  });
});

test('a role change takes effect on the very next request, without signing in again', async () => {
  const team = await createTeamFixture(t.ctx.db, 'Roles');
  const admin = await signedIn(team.accounts.admin.email);
  const other = await signedIn(team.accounts.coordinator.email);
  const staffPath = `/api/teams/${team.teamId}/staff`;
  expect((await other.get(staffPath)).status).toBe(403);

  const promoted = await admin.patch(memberPath(team, await membershipId(team, team.accounts.coordinator.userId)), { role: 'admin' });
  expect(promoted.status).toBe(200);
  expect(promoted.body).toMatchObject({ userId: team.accounts.coordinator.userId, role: 'admin', active: true });
  expect((await other.get(staffPath)).status).toBe(200);

  const demoted = await admin.patch(memberPath(team, await membershipId(team, team.accounts.coordinator.userId)), { role: 'coach' });
  expect(demoted.status).toBe(200);
  expect(demoted.body.role).toBe('coach');
  const refused = await other.get(staffPath);
  expect(refused.status).toBe(403);
  expect(refused.body.error.code).toBe('forbidden');
  expect((await other.post(`/api/teams/${team.teamId}/seasons`, { name: '2027', startsOn: '2027-08-01', endsOn: '2027-12-01' })).status).toBe(403);
  // Still signed in, now with the coach's rights.
  expect((await other.get(`/api/teams/${team.teamId}/players`)).status).toBe(200);
  expect((await other.get('/api/auth/me')).body.memberships[0].role).toBe('coach');
});

test('the last active admin cannot be demoted or deactivated (409); with a second admin they can', async () => {
  const team = await createTeamFixture(t.ctx.db, 'Last');
  const admin = await signedIn(team.accounts.admin.email);
  const self = await membershipId(team, team.accounts.admin.userId);

  const demote = await admin.patch(memberPath(team, self), { role: 'coach' });
  expect(demote.status).toBe(409);
  expect(demote.body.error.code).toBe('conflict');
  const deactivate = await admin.patch(memberPath(team, self), { active: false });
  expect(deactivate.status).toBe(409);
  expect(await activeAdmins(team.teamId)).toBe(1);
  expect((await admin.get(`/api/teams/${team.teamId}/staff`)).status).toBe(200);

  expect((await admin.patch(memberPath(team, await membershipId(team, team.accounts.coach.userId)), { role: 'admin' })).status).toBe(200);
  const stepDown = await admin.patch(memberPath(team, self), { role: 'coordinator' });
  expect(stepDown.status).toBe(200);
  expect((await admin.get(`/api/teams/${team.teamId}/staff`)).status).toBe(403);
  expect(await activeAdmins(team.teamId)).toBe(1);
});

test('two admins demoting each other at the same moment: one succeeds, the other is refused (409, or 403 once demoted), never 500', async () => {
  const team = await createTeamFixture(t.ctx.db, 'Race');
  const a = await signedIn(team.accounts.admin.email);
  const aId = await membershipId(team, team.accounts.admin.userId);
  const bId = await membershipId(team, team.accounts.coordinator.userId);
  const b = await signedIn(team.accounts.coordinator.email);
  const outcomes: string[] = [];
  for (let round = 0; round < 5; round += 1) {
    // Both are admins at the start of each round.
    await t.ctx.db.updateTable('memberships').set({ role: 'admin' }).where('id', 'in', [aId, bId]).execute();
    const [byA, byB] = await Promise.all([a.patch(memberPath(team, bId), { role: 'coach' }), b.patch(memberPath(team, aId), { role: 'coach' })]);
    outcomes.push([byA.status, byB.status].sort().join('/'));
    expect(await activeAdmins(team.teamId)).toBe(1);
  }
  // The loser gets 409 when it was still an admin at authorization, 403 when the winner's demotion
  // had already landed; a deadlock (500) or two successes (no admin left) are the failures.
  for (const outcome of outcomes) expect(['200/403', '200/409']).toContain(outcome);
});

test('a deactivated member loses access at once, their sessions end, and the row stays', async () => {
  const team = await createTeamFixture(t.ctx.db, 'Deactivate');
  const admin = await signedIn(team.accounts.admin.email);
  const laptop = await signedIn(team.accounts.coach.email);
  const tablet = await signedIn(team.accounts.coach.email);
  expect(await sessionsOf(team.accounts.coach.userId)).toBe(2);
  const id = await membershipId(team, team.accounts.coach.userId);

  const res = await admin.patch(memberPath(team, id), { active: false });
  expect(res.status).toBe(200);
  expect(res.body).toMatchObject({ membershipId: id, role: 'coach', active: false });

  expect((await laptop.get(`/api/teams/${team.teamId}/players`)).status).toBe(401);
  expect((await tablet.get('/api/auth/me')).status).toBe(401);
  expect(await sessionsOf(team.accounts.coach.userId)).toBe(0);

  // Signing in again gives no way back into the team.
  const again = await signedIn(team.accounts.coach.email);
  expect((await again.get('/api/auth/me')).body.memberships).toEqual([]);
  expect((await again.get(`/api/teams/${team.teamId}/players`)).status).toBe(403);

  // Nothing deleted: the member is listed as inactive, and can be reactivated.
  const staff = await admin.get(`/api/teams/${team.teamId}/staff`);
  expect(staff.body.members.find((m: { membershipId: number }) => m.membershipId === id)).toMatchObject({ active: false, role: 'coach' });
  expect((await admin.patch(memberPath(team, id), { active: true })).status).toBe(200);
  expect((await again.get(`/api/teams/${team.teamId}/players`)).status).toBe(200);
});

test('deactivated in one team but active in another: that team is closed at once, the other stays open', async () => {
  const team = await createTeamFixture(t.ctx.db, 'First');
  const second = await createTeamFixture(t.ctx.db, 'Second');
  await t.ctx.db.insertInto('memberships').values({ user_id: team.accounts.analyst.userId, team_id: second.teamId, role: 'coach' }).execute();
  const admin = await signedIn(team.accounts.admin.email);
  const analyst = await signedIn(team.accounts.analyst.email);
  expect((await admin.patch(memberPath(team, await membershipId(team, team.accounts.analyst.userId)), { active: false })).status).toBe(200);
  expect((await analyst.get(`/api/teams/${team.teamId}/players`)).status).toBe(403);
  expect((await analyst.get(`/api/teams/${second.teamId}/players`)).status).toBe(200);
  expect((await analyst.get('/api/auth/me')).body.memberships.map((m: { teamId: number }) => m.teamId)).toEqual([second.teamId]);
});

test("a member of another team cannot be changed through this team's path (404), and only admins manage staff", async () => {
  const team = await createTeamFixture(t.ctx.db, 'Mine');
  const other = await createTeamFixture(t.ctx.db, 'Theirs');
  const admin = await signedIn(team.accounts.admin.email);
  const foreignId = await membershipId(other, other.accounts.admin.userId);
  const res = await admin.patch(memberPath(team, foreignId), { active: false });
  expect(res.status).toBe(404);
  const row = await t.ctx.db.selectFrom('memberships').select(['active', 'role']).where('id', '=', foreignId).executeTakeFirstOrThrow();
  expect(row).toEqual({ active: true, role: 'admin' });

  const coordinator = await signedIn(team.accounts.coordinator.email);
  expect((await coordinator.get(`/api/teams/${team.teamId}/staff`)).status).toBe(403);
  expect((await coordinator.patch(memberPath(team, await membershipId(team, team.accounts.coach.userId)), { role: 'admin' })).status).toBe(403);
  expect((await t.ctx.db.selectFrom('memberships').select('role').where('user_id', '=', team.accounts.coach.userId).executeTakeFirstOrThrow()).role).toBe('coach');
});

test('bad changes → 422', async () => {
  const team = await createTeamFixture(t.ctx.db, 'Bad');
  const admin = await signedIn(team.accounts.admin.email);
  const id = await membershipId(team, team.accounts.coach.userId);
  const empty = await admin.patch(memberPath(team, id), {});
  expect(empty.status).toBe(422);
  const role = await admin.patch(memberPath(team, id), { role: 'owner' });
  expect(role.status).toBe(422);
  expect(Object.keys(role.body.error.fields)).toEqual(['role']);
});

test('a staff account cannot be turned into a player, nor a player into staff (409)', async () => {
  const team = await createTeamFixture(t.ctx.db, 'Roles');
  const admin = await signedIn(team.accounts.admin.email);
  const coachId = await membershipId(team, team.accounts.coach.userId);
  const playerId = await membershipId(team, team.accounts.player.userId);
  const toPlayer = await admin.patch(memberPath(team, coachId), { role: 'player' });
  expect(toPlayer.status).toBe(409);
  expect(toPlayer.body.error.fields).toHaveProperty('role');
  const toCoach = await admin.patch(memberPath(team, playerId), { role: 'coach' });
  expect(toCoach.status).toBe(409);
  const roles = await t.ctx.db.selectFrom('memberships').select(['id', 'role']).where('id', 'in', [coachId, playerId]).orderBy('id').execute();
  expect(roles.map((r) => r.role).sort()).toEqual(['coach', 'player']);
});
