import { z } from 'zod';
import { idParams } from '@shared/api/common';
import {
  commentEditSchema,
  commentSchema,
  cutupCreateSchema,
  cutupFilterSchema,
  cutupShareSchema,
  cutupUpdateSchema,
  mailPreferencesSchema,
  myClipsSchema,
  pointCreateSchema,
  questionCreateSchema,
  replyCreateSchema,
  viewReportSchema,
} from '@shared/api/film-room';
import { POSITION_GROUPS } from '@shared/film-room';
import { ROLES, STAFF_ROLES, type Role } from '@shared/roles';
import { forbidden } from '../core/errors';
import { defineRoute, Reply, type RouteDefinition } from '../core/route';
import { teamInBody, teamOfClip, teamOfSession } from '../film/team-resolvers';
import { acknowledge, createPoint, createQuestion, createReply, editComment, hideComment, listClipComments, teamOfComment } from './comments.service';
import { assertCutupVisible, clipsForFilter, createCutup, getCutup, listCutups, shareCutup, teamOfCutup, updateCutup } from './cutups.service';
import { getMailPreferences, saveMailPreferences, unsubscribe } from './digest.service';
import { myClips, recordView, studyReport } from './study.service';

const coaches: readonly Role[] = ['admin', 'coordinator', 'coach'];
const anyMemberOfClip = { kind: 'team', roles: ROLES, team: teamOfClip } as const;
const anyMemberOfComment = { kind: 'team', roles: ROLES, team: teamOfComment } as const;

/** Routes that act for the signed-in player need his team: the first team where he is a player. */
async function playerTeam(app: Parameters<Parameters<typeof defineRoute>[0]['handler']>[0]['app'], userId: number) {
  const row = await app.db.selectFrom('memberships').select(['id', 'team_id', 'role', 'player_id']).where('user_id', '=', userId).where('role', '=', 'player').where('active', '=', true).orderBy('id').executeTakeFirst();
  if (!row) throw forbidden('The study queue is for players.');
  return { id: row.id, teamId: row.team_id, role: 'player' as const, playerId: row.player_id };
}

export function filmRoomRoutes(): RouteDefinition[] {
  return [
    defineRoute({
      operationId: 'createCoachingPoint',
      method: 'post',
      path: '/clips/{id}/comments',
      summary: 'A coaching point on a clip for one or more players, at a moment (atMs) or a span (to endMs). Staff only.',
      tags: ['film room'],
      access: { kind: 'team', roles: coaches, team: teamOfClip },
      params: idParams,
      body: pointCreateSchema,
      responses: { 201: { description: 'The point', schema: commentSchema } },
      handler: async ({ app, params, body, user }) => createPoint(app, user!, params.id, body),
    }),
    defineRoute({
      operationId: 'listClipComments',
      method: 'get',
      path: '/clips/{id}/comments',
      summary: 'Threads on a clip: staff see all; a player those for him and his own questions, with replies.',
      tags: ['film room'],
      access: anyMemberOfClip,
      params: idParams,
      responses: { 200: { description: 'Threads', schema: z.object({ comments: z.array(commentSchema) }) } },
      handler: async ({ app, params, user, membership }) => ({ comments: await listClipComments(app, { userId: user!.id, membership: membership! }, params.id) }),
    }),
    defineRoute({
      operationId: 'askQuestion',
      method: 'post',
      path: '/clips/{id}/questions',
      summary: 'A player asks a question at a moment of a clip he can see; his coaches answer in the thread.',
      tags: ['film room'],
      access: { kind: 'team', roles: ['player'], team: teamOfClip },
      params: idParams,
      body: questionCreateSchema,
      responses: { 201: { description: 'The question', schema: commentSchema } },
      handler: async ({ app, params, body, user, membership }) => createQuestion(app, user!, membership!, params.id, body),
    }),
    defineRoute({
      operationId: 'replyToComment',
      method: 'post',
      path: '/comments/{id}/replies',
      summary: 'Reply in a thread (staff, or the player the thread is for).',
      tags: ['film room'],
      access: anyMemberOfComment,
      params: idParams,
      body: replyCreateSchema,
      responses: { 201: { description: 'The reply', schema: commentSchema } },
      handler: async ({ app, params, body, user, membership }) => createReply(app, user!, membership!, params.id, body.body),
    }),
    defineRoute({
      operationId: 'editComment',
      method: 'patch',
      path: '/comments/{id}',
      summary: 'Edit your own comment; the earlier text is kept.',
      tags: ['film room'],
      access: anyMemberOfComment,
      params: idParams,
      body: commentEditSchema,
      responses: { 200: { description: 'The comment', schema: commentSchema } },
      handler: async ({ app, params, body, user }) => editComment(app, user!, params.id, body.body),
    }),
    defineRoute({
      operationId: 'hideComment',
      method: 'delete',
      path: '/comments/{id}',
      summary: 'Remove a comment: it is hidden, its thread stays.',
      tags: ['film room'],
      access: anyMemberOfComment,
      params: idParams,
      responses: { 204: { description: 'Hidden' } },
      handler: async ({ app, params, user, membership }) => {
        await hideComment(app, user!, membership!, params.id);
        return new Reply(204);
      },
    }),
    defineRoute({
      operationId: 'acknowledgeComment',
      method: 'post',
      path: '/comments/{id}/acknowledge',
      summary: 'The player a coaching point is for says he got it.',
      tags: ['film room'],
      access: { kind: 'team', roles: ['player'], team: teamOfComment },
      params: idParams,
      responses: { 204: { description: 'Acknowledged' } },
      handler: async ({ app, params, membership }) => {
        await acknowledge(app, membership!, params.id);
        return new Reply(204);
      },
    }),
    defineRoute({
      operationId: 'recordClipView',
      method: 'post',
      path: '/clips/{id}/views',
      summary: 'A player reports a stretch of a clip he played (fromMs–toMs); replays count once.',
      tags: ['film room'],
      access: { kind: 'team', roles: ['player'], team: teamOfClip },
      params: idParams,
      body: viewReportSchema,
      responses: { 200: { description: 'How much of the clip he has watched', schema: z.object({ watchedFraction: z.number() }) } },
      handler: async ({ app, params, body, membership }) => recordView(app, membership!, params.id, body.fromMs, body.toMs),
    }),
    defineRoute({
      operationId: 'myClips',
      method: 'get',
      path: '/me/clips',
      summary: "The signed-in player's study queue: clips tagged to or shared with him, newest first, with his coaching points.",
      tags: ['film room'],
      access: { kind: 'signedIn' },
      responses: { 200: { description: 'The queue', schema: myClipsSchema }, 403: { description: 'Not a player' } },
      handler: async ({ app, user }) => myClips(app, await playerTeam(app, user!.id)),
    }),
    defineRoute({
      operationId: 'myCutups',
      method: 'get',
      path: '/me/cutups',
      summary: 'Cut-ups shared with the signed-in player.',
      tags: ['film room'],
      access: { kind: 'signedIn' },
      responses: { 200: { description: 'Cut-ups' }, 403: { description: 'Not a player' } },
      handler: async ({ app, user }) => listCutups(app, await playerTeam(app, user!.id)),
    }),
    defineRoute({
      operationId: 'studyReport',
      method: 'get',
      path: '/film-sessions/{id}/study-report',
      summary: 'Before the meeting: per player of a position group, clips and points of this session, watched and acknowledged.',
      tags: ['film room'],
      access: { kind: 'team', roles: STAFF_ROLES, team: teamOfSession },
      params: idParams,
      query: z.object({ group: z.enum(POSITION_GROUPS).default('OL') }),
      responses: { 200: { description: 'The report' } },
      handler: async ({ app, params, query }) => studyReport(app, params.id, query.group),
    }),
    defineRoute({
      operationId: 'previewCutup',
      method: 'post',
      path: '/cutups/preview',
      summary: 'The clips a cut-up filter picks (sessions, concepts, fronts, angle; one player graded plus or minus on a component).',
      tags: ['film room'],
      access: { kind: 'team', roles: STAFF_ROLES, team: teamInBody },
      body: z.object({ teamId: z.number().int(), filter: cutupFilterSchema }),
      responses: { 200: { description: 'Clips' } },
      handler: async ({ app, body }) => ({ clips: await clipsForFilter(app, body.teamId, body.filter) }),
    }),
    defineRoute({
      operationId: 'createCutup',
      method: 'post',
      path: '/cutups',
      summary: 'Build a cut-up from a filter or from chosen clips.',
      tags: ['film room'],
      access: { kind: 'team', roles: coaches, team: teamInBody },
      body: cutupCreateSchema,
      responses: { 201: { description: 'The cut-up' } },
      handler: async ({ app, body, user }) => new Reply(201, await createCutup(app, user!.id, body)),
    }),
    defineRoute({
      operationId: 'listCutups',
      method: 'get',
      path: '/teams/{teamId}/cutups',
      summary: "The team's cut-ups (a player: those shared with him).",
      tags: ['film room'],
      access: { kind: 'team', roles: ROLES, team: async (_app, params: { teamId: number }) => params.teamId },
      params: z.object({ teamId: z.coerce.number().int().positive() }),
      responses: { 200: { description: 'Cut-ups' } },
      handler: async ({ app, membership }) => listCutups(app, membership!),
    }),
    defineRoute({
      operationId: 'getCutup',
      method: 'get',
      path: '/cutups/{id}',
      summary: 'A cut-up with its clips in order, notes and who it is shared with.',
      tags: ['film room'],
      access: { kind: 'team', roles: ROLES, team: teamOfCutup },
      params: idParams,
      responses: { 200: { description: 'The cut-up' } },
      handler: async ({ app, params, membership }) => {
        await assertCutupVisible(app, membership!, params.id);
        return getCutup(app, params.id);
      },
    }),
    defineRoute({
      operationId: 'updateCutup',
      method: 'patch',
      path: '/cutups/{id}',
      summary: 'Reorder, annotate, rename a cut-up.',
      tags: ['film room'],
      access: { kind: 'team', roles: coaches, team: teamOfCutup },
      params: idParams,
      body: cutupUpdateSchema,
      responses: { 200: { description: 'The cut-up' } },
      handler: async ({ app, params, body }) => updateCutup(app, params.id, body),
    }),
    defineRoute({
      operationId: 'shareCutup',
      method: 'put',
      path: '/cutups/{id}/shares',
      summary: 'Share a cut-up with players and position groups (replaces the list).',
      tags: ['film room'],
      access: { kind: 'team', roles: coaches, team: teamOfCutup },
      params: idParams,
      body: cutupShareSchema,
      responses: { 200: { description: 'The cut-up' } },
      handler: async ({ app, params, body }) => shareCutup(app, params.id, body),
    }),
    defineRoute({
      operationId: 'getMailPreferences',
      method: 'get',
      path: '/me/mail-preferences',
      summary: 'Which mails the signed-in account gets, and how often.',
      tags: ['film room'],
      access: { kind: 'signedIn' },
      responses: { 200: { description: 'Preferences', schema: mailPreferencesSchema } },
      handler: async ({ app, user }) => getMailPreferences(app, user!.id),
    }),
    defineRoute({
      operationId: 'saveMailPreferences',
      method: 'put',
      path: '/me/mail-preferences',
      summary: 'Choose the coaching digest (and how often) and the weekly summary. Invitations and resets always go.',
      tags: ['film room'],
      access: { kind: 'signedIn' },
      body: mailPreferencesSchema,
      responses: { 200: { description: 'Preferences', schema: mailPreferencesSchema } },
      handler: async ({ app, user, body }) => saveMailPreferences(app, user!.id, body),
    }),
    defineRoute({
      operationId: 'unsubscribe',
      method: 'post',
      path: '/mail/unsubscribe',
      summary: "Turn off one list from a mail's unsubscribe link (no sign-in needed; the link's token names the account and list).",
      tags: ['film room'],
      access: { kind: 'public' },
      body: z.object({ token: z.string().min(10).max(200) }),
      responses: { 200: { description: 'Done', schema: z.object({ list: z.enum(['digest', 'weekly']) }) }, 400: { description: 'Invalid link' } },
      handler: async ({ app, body }) => unsubscribe(app, body.token),
    }),
    defineRoute({
      operationId: 'sendWeeklySummaries',
      method: 'post',
      path: '/teams/{teamId}/weekly-summaries',
      summary: 'Send the weekly development summary to every player of the team now (it also goes out every Monday).',
      tags: ['film room'],
      access: { kind: 'team', roles: ['admin', 'coordinator'], team: async (_app, params: { teamId: number }) => params.teamId },
      params: z.object({ teamId: z.coerce.number().int().positive() }),
      responses: { 202: { description: 'Queued' } },
      handler: async ({ app, params }) => {
        await app.jobs.send('summary.weekly', { teamId: params.teamId });
        return new Reply(202, {});
      },
    }),
  ];
}
