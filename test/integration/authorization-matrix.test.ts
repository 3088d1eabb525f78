import { ROLES, type Role } from '@shared/roles';
import { ApiClient } from '../support/api-client';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * Every route in the OpenAPI document × every role, anonymous, and an admin of another team.
 * The expected access is written out here, independently of the routes' own declarations, and the
 * test fails when a route exists without an entry (or an entry without a route).
 */
type Caller = 'anonymous' | Role | 'otherTeamAdmin';
// Least privileged first: a route that deletes its object runs for those who must be refused
// before an allowed caller removes the object.
const CALLERS: Caller[] = ['anonymous', 'otherTeamAdmin', 'player', 'analyst', 'coach', 'coordinator', 'admin'];
// 'players': any signed-in account may call it, but only a player gets an answer (others 403).
type Rule = 'public' | 'signedIn' | 'players' | readonly Role[];

const STAFF: readonly Role[] = ['admin', 'coordinator', 'coach', 'analyst'];
const EDITORS: readonly Role[] = ['admin', 'coordinator'];
const ADMIN: readonly Role[] = ['admin'];
const LIST_EDITORS: readonly Role[] = ['admin', 'coordinator', 'analyst'];
const GRADERS: readonly Role[] = ['admin', 'coordinator', 'coach'];

const EXPECTED: Record<string, Rule> = {
  health: 'public',
  ready: 'public',
  login: 'public',
  logout: 'public',
  me: 'signedIn',
  requestPasswordReset: 'public',
  confirmPasswordReset: 'public',
  previewInvitation: 'public',
  acceptInvitation: 'public',
  devMail: 'public',
  getTeam: ROLES,
  createSeason: ADMIN,
  listPlayers: STAFF,
  exportRoster: STAFF,
  addPlayer: EDITORS,
  updatePlayer: EDITORS,
  importRoster: EDITORS,
  listStaff: ADMIN,
  createInvitation: ADMIN,
  resendInvitation: ADMIN,
  revokeInvitation: ADMIN,
  updateMember: ADMIN,
  listFilmSessions: STAFF,
  createFilmSession: STAFF,
  getFilmSession: STAFF,
  updateFilmSession: STAFF,
  uploadClips: STAFF,
  listSessionClips: STAFF,
  listSnaps: STAFF,
  createSnap: STAFF,
  bulkTagSnaps: STAFF,
  exportSnapsCsv: STAFF,
  importSnapsCsv: STAFF,
  tagSnap: STAFF,
  deleteSnap: STAFF,
  getClip: ROLES,
  placeClip: STAFF,
  removeClip: STAFF,
  retryClip: STAFF,
  detectTapeCuts: STAFF,
  splitTape: STAFF,
  clipPoster: ROLES,
  clipStrip: ROLES,
  clipPlayback: ROLES,
  listTagLists: STAFF,
  addTagListItem: LIST_EDITORS,
  updateTagListItem: LIST_EDITORS,
  saveGrade: GRADERS,
  listSnapGrades: GRADERS,
  setSnapParticipants: GRADERS,
  gradingDesk: GRADERS,
  gradingProgress: STAFF,
  setGradingLock: EDITORS,
  gradeSheet: ROLES,
  // Object level: a player opens only his own row; the fixture's player is another lineman.
  playerGradeSheet: STAFF,
  gradeSheetCsv: STAFF,
  mailGradeSheet: GRADERS,
  getGradingScheme: STAFF,
  saveGradingScheme: EDITORS,
  getDepthChart: STAFF,
  saveDepthChart: EDITORS,
  depthChartHistory: STAFF,
  practiceReps: STAFF,
  createCoachingPoint: GRADERS,
  listClipComments: ROLES,
  askQuestion: ['player'],
  replyToComment: ROLES,
  editComment: ROLES,
  // Object level: the fixture's comment is the coach's; leads may remove any; others only their own.
  hideComment: GRADERS,
  acknowledgeComment: ['player'],
  recordClipView: ['player'],
  myClips: 'players',
  myCutups: 'players',
  studyReport: STAFF,
  previewCutup: STAFF,
  createCutup: GRADERS,
  listCutups: ROLES,
  getCutup: ROLES,
  updateCutup: GRADERS,
  shareCutup: GRADERS,
  getMailPreferences: 'signedIn',
  saveMailPreferences: 'signedIn',
  unsubscribe: 'public',
  sendWeeklySummaries: EDITORS,
  // Object level: a player reads only his own page; the fixture's player is another lineman.
  playerDevelopment: STAFF,
  addPlayerGoal: GRADERS,
  updatePlayerGoal: GRADERS,
  addPlayerNote: GRADERS,
  comparePlayers: STAFF,
  graderAgreement: GRADERS,
  // Unit numbers reach players only when the staff shares them (off in the fixture).
  readinessMatrix: STAFF,
  lineDashboard: STAFF,
  teamSharing: EDITORS,
  thisWeek: STAFF,
};

/** Requests that name their team outside the path carry it, so a stranger is refused for the team, not the form. */
const QUERY: Record<string, (f: TeamFixture) => string> = {
  listFilmSessions: (f) => `teamId=${f.teamId}`,
  comparePlayers: (f) => `players=${f.playerIds[0]},${f.playerIds[2]}`,
  graderAgreement: (f) => `graderA=${f.accounts.coach.userId}&graderB=${f.accounts.coordinator.userId}`,
};
const BODY: Record<string, (f: TeamFixture) => object> = { createFilmSession: (f) => ({ teamId: f.teamId }), previewCutup: (f) => ({ teamId: f.teamId }), createCutup: (f) => ({ teamId: f.teamId }) };

function expectedStatus(rule: Rule, caller: Caller): 'allowed' | 401 | 403 {
  if (rule === 'public') return 'allowed';
  if (caller === 'anonymous') return 401;
  if (rule === 'signedIn') return 'allowed';
  if (rule === 'players') return caller === 'player' ? 'allowed' : 403;
  if (caller === 'otherTeamAdmin') return 403;
  return rule.includes(caller) ? 'allowed' : 403;
}

interface Operation {
  operationId: string;
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
}

let t: TestApp;
let team: TeamFixture;
let other: TeamFixture;
const clients = new Map<Caller, ApiClient>();
let operations: Operation[];
let invitationId: number;
let coachMembershipId: number;
let film: { sessionId: number; snapId: number; clipId: number; tagItemId: number; commentId: number; cutupId: number };

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeamFixture(t.ctx.db, 'Matrix');
  other = await createTeamFixture(t.ctx.db, 'Other');
  const inviter = team.accounts.admin.userId;
  const invitation = await t.ctx.db
    .insertInto('invitations')
    .values({ team_id: team.teamId, email: 'pending@matrix.test', role: 'coach', token_hash: 'x'.repeat(64), invited_by: inviter, expires_at: new Date(Date.now() + 3_600_000) })
    .returning('id')
    .executeTakeFirstOrThrow();
  invitationId = invitation.id;
  film = await createFilmFixture(t, team);
  coachMembershipId = (await t.ctx.db.selectFrom('memberships').select('id').where('user_id', '=', team.accounts.coach.userId).executeTakeFirstOrThrow()).id;
  for (const caller of CALLERS) {
    const client = t.client();
    if (caller !== 'anonymous') {
      const email = caller === 'otherTeamAdmin' ? other.accounts.admin.email : team.accounts[caller].email;
      const res = await client.login(email, TEST_PASSWORD);
      expect(res.status).toBe(200);
    }
    clients.set(caller, client);
  }
  const doc = (await t.client().get('/api/openapi.json')).body as { paths: Record<string, Record<string, { operationId: string }>> };
  operations = Object.entries(doc.paths).flatMap(([path, methods]) =>
    Object.entries(methods).map(([method, op]) => ({ operationId: op.operationId, method: method as Operation['method'], path })),
  );
  // Deletions and sign-out (which ends the caller's session) run last.
  // Removing the clip takes its comments with it, so it goes after the comment's own removal.
  const last = (o: Operation) => Number(o.method === 'delete') + Number(o.operationId === 'removeClip') + 3 * Number(o.operationId === 'logout');
  operations.sort((a, b) => last(a) - last(b));
});

afterAll(async () => {
  await t?.close();
});

async function createFilmFixture(app: TestApp, f: TeamFixture) {
  const db = app.ctx.db;
  const session = await db
    .insertInto('film_sessions')
    .values({ team_id: f.teamId, season_id: f.seasonId, kind: 'game', title: 'Week 1', date: '2026-09-04', opponent: 'Hollow Creek' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const snap = await db.insertInto('snaps').values({ session_id: session.id, order: 1 }).returning('id').executeTakeFirstOrThrow();
  const clip = await db
    .insertInto('clips')
    .values({ team_id: f.teamId, session_id: session.id, snap_id: snap.id, upload_order: 1, original_name: 'play1.mp4', status: 'failed', failure_reason: 'not a video file' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const comment = await db
    .insertInto('clip_comments')
    .values({ team_id: f.teamId, clip_id: clip.id, author_id: f.accounts.coach.userId, at_ms: 0, kind: 'teaching', body: 'Hat on the 3 technique.' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const cutup = await db.insertInto('cutups').values({ team_id: f.teamId, title: 'Pad level', created_by: f.accounts.coach.userId }).returning('id').executeTakeFirstOrThrow();
  const item = await db.insertInto('tag_list_items').values({ team_id: f.teamId, kind: 'front', name: 'over' }).returning('id').executeTakeFirstOrThrow();
  return { sessionId: session.id, snapId: snap.id, clipId: clip.id, tagItemId: item.id, commentId: comment.id, cutupId: cutup.id };
}

function concretePath(path: string): string {
  const idFor = path.startsWith('/api/film-sessions/')
    ? film.sessionId
    : path.startsWith('/api/snaps/')
      ? film.snapId
      : path.startsWith('/api/comments/')
        ? film.commentId
        : path.startsWith('/api/cutups/')
          ? film.cutupId
          : film.clipId;
  const values: Record<string, string> = {
    id: String(path.startsWith('/api/players/') ? team.playerIds[0] : idFor),
    goalId: '999999',
    snapId: String(film.snapId),
    itemId: String(film.tagItemId),
    teamId: String(team.teamId),
    playerId: String(team.playerIds[0]),
    invitationId: String(invitationId),
    membershipId: String(coachMembershipId),
    token: 'not-a-real-token-0123456789',
  };
  return path.replace(/\{(\w+)\}/g, (_m, name: string) => {
    if (!(name in values)) throw new Error(`No test value for path parameter ${name}`);
    return values[name]!;
  });
}

test('every documented route has an expected-access entry, and every entry a route', () => {
  const documented = operations.map((o) => o.operationId).sort();
  expect(documented).toEqual(Object.keys(EXPECTED).sort());
});

test('every route answers each caller as expected (0 unexpected successes)', async () => {
  const failures: string[] = [];
  let checked = 0;
  for (const op of operations) {
    for (const caller of CALLERS) {
      const client = clients.get(caller)!;
      const query = QUERY[op.operationId] !== undefined ? `?${QUERY[op.operationId]!(team)}` : '';
      const url = concretePath(op.path) + query;
      // Empty bodies: an allowed caller gets a validation error, never a change of state.
      const body = op.operationId === 'logout' ? undefined : (BODY[op.operationId]?.(team) ?? {});
      const res = op.method === 'get' ? await client.get(url) : await client.send(op.method, url, body);
      const expected = expectedStatus(EXPECTED[op.operationId]!, caller);
      checked += 1;
      const ok = expected === 'allowed' ? res.status !== 401 && res.status !== 403 && res.status < 500 : res.status === expected;
      if (!ok) failures.push(`${op.method.toUpperCase()} ${op.path} as ${caller}: got ${res.status}, expected ${expected}`);
      if (res.status >= 400) expect(res.body.error?.code).toEqual(expect.any(String));
    }
  }
  expect(failures).toEqual([]);
  expect(checked).toBe(operations.length * CALLERS.length);
});
