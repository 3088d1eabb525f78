import { z } from 'zod';
import { idParams, idSchema, teamParams } from '@shared/api/common';
import {
  deskSchema,
  depthChartHistorySchema,
  depthChartInputSchema,
  depthChartQuerySchema,
  depthChartSchema,
  gradeInputSchema,
  gradeParams,
  gradeSchema,
  gradeSheetSchema,
  gradingLockSchema,
  gradingProgressSchema,
  participantsInputSchema,
  schemeInputSchema,
  schemeSchema,
} from '@shared/api/grading';
import { playerGradeSheetSchema, playerSheetParams } from '@shared/api/player-grades';
import { GRADING_ROLES, ROLES, STAFF_ROLES, type Role } from '@shared/roles';
import { defineRoute, Reply, teamFromPath, type RouteDefinition } from '../core/route';
import { teamOfSession, teamOfSnap } from '../film/team-resolvers';
import { depthChartHistory, getDepthChart, saveDepthChart } from './depth-chart.service';
import { listSnapGrades, loadDesk, setParticipants } from './desk.service';
import { buildGradeSheet, gradeSheetCsv } from './grade-sheet.service';
import { playerGradeSheet } from './player-grades.service';
import { saveGrade } from './grades.service';
import { gradingProgress, setGradingLock } from './progress.service';
import { getScheme, saveScheme } from './scheme.service';
import { mailGradeSheet } from './sheet-mail.service';
import { practiceReps } from './reps.service';

const graders = GRADING_ROLES;
const leads: readonly Role[] = ['admin', 'coordinator'];
const snapGraders = { kind: 'team', roles: graders, team: teamOfSnap } as const;

export function gradingRoutes(): RouteDefinition[] {
  return [
    defineRoute({
      operationId: 'saveGrade',
      method: 'put',
      path: '/snaps/{snapId}/grades/{playerId}',
      summary: "Save the signed-in coach's grade of one lineman on one snap. version 0 or omitted for a new grade; a stale version → 409 with the current grade.",
      tags: ['grading'],
      access: { kind: 'team', roles: graders, team: async (app, params: { snapId: number }) => teamOfSnap(app, { id: params.snapId }) },
      params: gradeParams,
      body: gradeInputSchema,
      responses: { 200: { description: 'The stored grade with its new version', schema: gradeSchema }, 409: { description: 'Stale version (error.current holds the grade) or session locked' } },
      handler: async ({ app, params, body, user }) => saveGrade(app, user!, params.snapId, params.playerId, body),
    }),
    defineRoute({
      operationId: 'listSnapGrades',
      method: 'get',
      path: '/snaps/{id}/grades',
      summary: "Every coach's grades on one snap (to compare graders).",
      tags: ['grading'],
      access: snapGraders,
      params: idParams,
      responses: { 200: { description: 'Grades', schema: z.object({ grades: z.array(gradeSchema) }) } },
      handler: async ({ app, params }) => listSnapGrades(app, params.id),
    }),
    defineRoute({
      operationId: 'setSnapParticipants',
      method: 'put',
      path: '/snaps/{id}/participants',
      summary: 'Who blocked on this snap and where (substitutions, heavy sets). An empty list falls back to the depth chart starters.',
      tags: ['grading'],
      access: snapGraders,
      params: idParams,
      body: participantsInputSchema,
      responses: { 200: { description: 'The participants', schema: participantsInputSchema } },
      handler: async ({ app, params, body }) => setParticipants(app, params.id, body.participants),
    }),
    defineRoute({
      operationId: 'gradingDesk',
      method: 'get',
      path: '/film-sessions/{id}/desk',
      summary: "Everything the Grading Desk needs for a session: scheme, roster, each snap's linemen and the signed-in coach's grades.",
      tags: ['grading'],
      access: { kind: 'team', roles: graders, team: teamOfSession },
      params: idParams,
      responses: { 200: { description: 'The desk', schema: deskSchema } },
      handler: async ({ app, params, user }) => loadDesk(app, params.id, user!.id),
    }),
    defineRoute({
      operationId: 'gradingProgress',
      method: 'get',
      path: '/film-sessions/{id}/grading-progress',
      summary: 'Cells graded / expected per grader, and the lock with its history.',
      tags: ['grading'],
      access: { kind: 'team', roles: STAFF_ROLES, team: teamOfSession },
      params: idParams,
      responses: { 200: { description: 'Progress', schema: gradingProgressSchema } },
      handler: async ({ app, params }) => gradingProgress(app, params.id),
    }),
    defineRoute({
      operationId: 'setGradingLock',
      method: 'post',
      path: '/film-sessions/{id}/grading-lock',
      summary: "Lock a session's grades when done, or unlock with a reason (recorded with who and when).",
      tags: ['grading'],
      access: { kind: 'team', roles: leads, team: teamOfSession },
      params: idParams,
      body: gradingLockSchema,
      responses: { 200: { description: 'Progress', schema: gradingProgressSchema }, 422: { description: 'Unlock without a reason' } },
      handler: async ({ app, params, body, user }) => setGradingLock(app, params.id, user!.id, body.locked, body.reason),
    }),
    defineRoute({
      operationId: 'gradeSheet',
      method: 'get',
      path: '/film-sessions/{id}/grade-sheet',
      summary: "Per-player numbers for a session from the final grades (a player sees only his own, when the staff shares grades).",
      tags: ['grading'],
      access: { kind: 'team', roles: ROLES, team: teamOfSession },
      params: idParams,
      responses: { 200: { description: 'The sheet', schema: gradeSheetSchema } },
      handler: async ({ app, params, membership }) => buildGradeSheet(app, params.id, membership!),
    }),
    defineRoute({
      operationId: 'playerGradeSheet',
      method: 'get',
      path: '/film-sessions/{id}/grade-sheet/players/{playerId}',
      summary: "One player's row of the session's Grade Sheet, with the names of the team's own parts. A player opens only his own, and only when the staff shares grades.",
      tags: ['grading'],
      access: { kind: 'team', roles: ROLES, team: teamOfSession },
      params: playerSheetParams,
      responses: {
        200: { description: 'His row (null before his first final grade)', schema: playerGradeSheetSchema },
        403: { description: "Another player's sheet, or grades not shared with players" },
        404: { description: 'No such session or no such player on its team' },
      },
      handler: async ({ app, params, membership }) => playerGradeSheet(app, params.id, params.playerId, membership!),
    }),
    defineRoute({
      operationId: 'gradeSheetCsv',
      method: 'get',
      path: '/film-sessions/{id}/grade-sheet.csv',
      summary: 'The grade sheet as CSV.',
      tags: ['grading'],
      access: { kind: 'team', roles: STAFF_ROLES, team: teamOfSession },
      params: idParams,
      responses: { 200: { description: 'CSV', contentType: 'text/csv' } },
      handler: async ({ app, params, res, membership }) => {
        const csv = gradeSheetCsv(await buildGradeSheet(app, params.id, membership!));
        res.set('Content-Type', 'text/csv; charset=utf-8').set('Content-Disposition', `attachment; filename="grade-sheet-${params.id}.csv"`).status(200).send(csv);
      },
    }),
    defineRoute({
      operationId: 'mailGradeSheet',
      method: 'post',
      path: '/film-sessions/{id}/grade-sheet/mail',
      summary: 'Mail a player his grade sheet for this session.',
      tags: ['grading'],
      access: { kind: 'team', roles: graders, team: teamOfSession },
      params: idParams,
      body: z.object({ playerId: idSchema }),
      responses: { 202: { description: 'Queued' }, 409: { description: 'The player has no account' } },
      handler: async ({ app, params, body, membership }) => {
        await mailGradeSheet(app, params.id, body.playerId, membership!);
        return new Reply(202, {});
      },
    }),
    defineRoute({
      operationId: 'practiceReps',
      method: 'get',
      path: '/teams/{teamId}/reps',
      summary: "Graded practice reps per player in a season, by practice period, concept and front.",
      tags: ['grading'],
      access: { kind: 'team', roles: STAFF_ROLES, team: teamFromPath },
      params: teamParams,
      query: z.object({ seasonId: idSchema.optional() }),
      responses: { 200: { description: 'Rep counts' } },
      handler: async ({ app, params, query }) => practiceReps(app, params.teamId, query.seasonId),
    }),
    defineRoute({
      operationId: 'getGradingScheme',
      method: 'get',
      path: '/teams/{teamId}/grading-scheme',
      summary: "The team's current grading scheme.",
      tags: ['grading'],
      access: { kind: 'team', roles: STAFF_ROLES, team: teamFromPath },
      params: teamParams,
      responses: { 200: { description: 'The scheme', schema: schemeSchema } },
      handler: async ({ app, params }) => getScheme(app, params.teamId),
    }),
    defineRoute({
      operationId: 'saveGradingScheme',
      method: 'put',
      path: '/teams/{teamId}/grading-scheme',
      summary: 'Save the grading scheme as a new version (grades keep the version they were made under).',
      tags: ['grading'],
      access: { kind: 'team', roles: leads, team: teamFromPath },
      params: teamParams,
      body: schemeInputSchema,
      responses: { 200: { description: 'The new version', schema: schemeSchema } },
      handler: async ({ app, params, body, user }) => saveScheme(app, params.teamId, user!.id, body),
    }),
    defineRoute({
      operationId: 'getDepthChart',
      method: 'get',
      path: '/teams/{teamId}/depth-chart',
      summary:
        "A season's depth chart at a week: ordered candidates at LT, LG, C, RG, RT and TE. A chart saved for week W is in force until a later week's chart (week 0: the base chart); without `week`, the current (latest saved) chart.",
      tags: ['grading'],
      access: { kind: 'team', roles: STAFF_ROLES, team: teamFromPath },
      params: teamParams,
      query: depthChartQuerySchema,
      responses: { 200: { description: 'The chart in force at the week, and the week it was saved for', schema: depthChartSchema } },
      handler: async ({ app, params, query }) => getDepthChart(app, params.teamId, query.seasonId, query.week),
    }),
    defineRoute({
      operationId: 'saveDepthChart',
      method: 'put',
      path: '/teams/{teamId}/depth-chart',
      summary: "Reorder one week's depth chart (default: the current week). The week gets its own chart: the one carried into it with the positions sent replaced; the change is kept with who, when, why and the week.",
      tags: ['grading'],
      access: { kind: 'team', roles: leads, team: teamFromPath },
      params: teamParams,
      body: depthChartInputSchema,
      responses: { 200: { description: 'The chart', schema: depthChartSchema } },
      handler: async ({ app, params, body, user }) => saveDepthChart(app, params.teamId, user!.id, body),
    }),
    defineRoute({
      operationId: 'depthChartHistory',
      method: 'get',
      path: '/teams/{teamId}/depth-chart/history',
      summary: "Changes to the depth chart, newest first, with who, when, why and the week saved for (`week`: that week's chart only).",
      tags: ['grading'],
      access: { kind: 'team', roles: STAFF_ROLES, team: teamFromPath },
      params: teamParams,
      query: depthChartQuerySchema,
      responses: { 200: { description: 'Changes', schema: depthChartHistorySchema } },
      handler: async ({ app, params, query }) => depthChartHistory(app, params.teamId, query.seasonId, query.week),
    }),
  ];
}
