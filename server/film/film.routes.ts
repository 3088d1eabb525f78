import { z } from 'zod';
import { idParams, idSchema, teamParams } from '@shared/api/common';
import {
  clipSchema,
  filmSessionCreateSchema,
  filmSessionListQuerySchema,
  filmSessionSchema,
  filmSessionUpdateSchema,
  snapBulkUpdateSchema,
  snapCreateSchema,
  snapSchema,
  snapsCsvImportSchema,
  snapTagsUpdateSchema,
  tagListCreateSchema,
  tagListItemSchema,
  tapeCutsSchema,
  tapeDetectSchema,
  uploadFormSchema,
  uploadResponseSchema,
} from '@shared/api/film';
import { ROLES, STAFF_ROLES, type Role } from '@shared/roles';
import { assertClipVisible } from '../film-room/visibility';
import { defineRoute, Reply, teamFromPath, type RouteDefinition } from '../core/route';
import { getClip, listClips, receiveUpload, removeClip, retryClip, streamClipMedia } from './clips.service';
import { createFilmSession, getFilmSession, listFilmSessions, updateFilmSession } from './film-sessions.service';
import { bulkUpdateSnapTags, createSnap, deleteSnap, exportSnapsCsv, importSnapsCsv, listSessionSnaps, placeClip, updateSnapTags } from './snaps.service';
import { addTagListItem, listTagLists, setTagListItemActive } from './tag-lists.service';
import { confirmCuts, redetectCuts } from './tape.service';
import { teamInBody, teamInQuery, teamOfClip, teamOfSession, teamOfSnap } from './team-resolvers';

const staff = STAFF_ROLES;
const listEditors: readonly Role[] = ['admin', 'coordinator', 'analyst'];
const sessionAccess = { kind: 'team', roles: staff, team: teamOfSession } as const;
const clipAccess = { kind: 'team', roles: staff, team: teamOfClip } as const;
/** Players may read a clip and its media when it is tagged to or shared with them (checked per clip). */
const clipReaders = { kind: 'team', roles: ROLES, team: teamOfClip } as const;

function mediaRoute(variant: 'poster' | 'playback' | 'strip', description: string, contentType: string): RouteDefinition {
  return defineRoute({
    operationId: `clip${variant[0]!.toUpperCase()}${variant.slice(1)}`,
    method: 'get',
    path: `/clips/{id}/${variant}`,
    summary: `${description} Answers Range requests with 206. Team members only.`,
    tags: ['film'],
    access: clipReaders,
    params: idParams,
    responses: { 200: { description, contentType }, 206: { description: 'Partial content', contentType }, 404: { description: 'Not made yet, or not shared with this player' } },
    handler: async ({ app, req, res, params, membership }) => {
      await assertClipVisible(app, membership!, params.id);
      return streamClipMedia(app, req, res, params.id, variant);
    },
  });
}

export function filmRoutes(): RouteDefinition[] {
  return [
    defineRoute({
      operationId: 'listFilmSessions',
      method: 'get',
      path: '/film-sessions',
      summary: "A season's film sessions (default: current season) with snap and clip counts.",
      tags: ['film'],
      access: { kind: 'team', roles: staff, team: teamInQuery },
      query: filmSessionListQuerySchema,
      responses: { 200: { description: 'Sessions', schema: z.object({ sessions: z.array(filmSessionSchema), seasonId: z.number() }) } },
      handler: async ({ app, query }) => listFilmSessions(app, query.teamId, query.seasonId, query.kind),
    }),
    defineRoute({
      operationId: 'createFilmSession',
      method: 'post',
      path: '/film-sessions',
      summary: "Add a game, scrimmage or practice to a season (default: the team's current one).",
      tags: ['film'],
      access: { kind: 'team', roles: staff, team: teamInBody },
      body: filmSessionCreateSchema,
      responses: { 201: { description: 'The session', schema: filmSessionSchema } },
      handler: async ({ app, body, user }) => createFilmSession(app, user!.id, body),
    }),
    defineRoute({
      operationId: 'getFilmSession',
      method: 'get',
      path: '/film-sessions/{id}',
      summary: 'One film session with its counts.',
      tags: ['film'],
      access: sessionAccess,
      params: idParams,
      responses: { 200: { description: 'The session', schema: filmSessionSchema } },
      handler: async ({ app, params }) => getFilmSession(app, params.id),
    }),
    defineRoute({
      operationId: 'updateFilmSession',
      method: 'patch',
      path: '/film-sessions/{id}',
      summary: "Edit a session's title, date, opponent, week or practice periods.",
      tags: ['film'],
      access: sessionAccess,
      params: idParams,
      body: filmSessionUpdateSchema,
      responses: { 200: { description: 'The session', schema: filmSessionSchema } },
      handler: async ({ app, params, body }) => updateFilmSession(app, params.id, body),
    }),
    defineRoute({
      operationId: 'uploadClips',
      method: 'post',
      path: '/film-sessions/{id}/clips',
      summary:
        'Upload clips (multipart, parts named "files"; optional fields "angle": sideline|end_zone|other and "kind": snap|tape — send fields before files). ' +
        'Files are streamed to storage; a file that is not a video becomes a failed clip with the reason; the same file twice is skipped.',
      tags: ['film'],
      access: sessionAccess,
      params: idParams,
      multipartBody: uploadFormSchema,
      responses: {
        201: { description: 'Clips received and queued for processing', schema: uploadResponseSchema },
        413: { description: 'A file is over the size limit; nothing from the upload is kept' },
        422: { description: 'No file, or bad fields' },
      },
      handler: async ({ app, req, res, params, membership }) => {
        const result = await receiveUpload(app, req, res, membership!.teamId, params.id, req.user!.id);
        return new Reply(201, result);
      },
    }),
    defineRoute({
      operationId: 'listSessionClips',
      method: 'get',
      path: '/film-sessions/{id}/clips',
      summary: "Every clip of a session with its state and progress (poll while any is not final).",
      tags: ['film'],
      access: sessionAccess,
      params: idParams,
      responses: { 200: { description: 'Clips', schema: z.object({ clips: z.array(clipSchema) }) } },
      handler: async ({ app, params }) => ({ clips: await listClips(app, params.id) }),
    }),
    defineRoute({
      operationId: 'listSnaps',
      method: 'get',
      path: '/film-sessions/{id}/snaps',
      summary: 'The snaps of a session in order, with their angles and play data.',
      tags: ['film'],
      access: sessionAccess,
      params: idParams,
      responses: { 200: { description: 'Snaps', schema: z.object({ snaps: z.array(snapSchema) }) } },
      handler: async ({ app, params }) => ({ snaps: await listSessionSnaps(app, params.id) }),
    }),
    defineRoute({
      operationId: 'createSnap',
      method: 'post',
      path: '/film-sessions/{id}/snaps',
      summary: 'Add an empty snap (at the end, or at an order, moving later snaps down).',
      tags: ['film'],
      access: sessionAccess,
      params: idParams,
      body: snapCreateSchema,
      responses: { 201: { description: 'The snap', schema: snapSchema } },
      handler: async ({ app, params, body }) => createSnap(app, params.id, body.order),
    }),
    defineRoute({
      operationId: 'bulkTagSnaps',
      method: 'post',
      path: '/film-sessions/{id}/snaps/bulk-tags',
      summary: 'Apply the same play data to a range of snaps.',
      tags: ['film'],
      access: sessionAccess,
      params: idParams,
      body: snapBulkUpdateSchema,
      responses: { 200: { description: 'Snaps', schema: z.object({ snaps: z.array(snapSchema) }) } },
      handler: async ({ app, params, body, membership }) => ({ snaps: await bulkUpdateSnapTags(app, membership!.teamId, params.id, body.snapIds, body.tags) }),
    }),
    defineRoute({
      operationId: 'exportSnapsCsv',
      method: 'get',
      path: '/film-sessions/{id}/snaps/export.csv',
      summary: 'Play data as CSV (columns snap, quarter, down, distance, yard_line, side, hash, personnel, formation, concept, direction, front, gain, outcome, period, notes).',
      tags: ['film'],
      access: sessionAccess,
      params: idParams,
      responses: { 200: { description: 'CSV', contentType: 'text/csv' } },
      handler: async ({ app, params, res, membership }) => {
        const csv = await exportSnapsCsv(app, membership!.teamId, params.id);
        res.set('Content-Type', 'text/csv; charset=utf-8').set('Content-Disposition', `attachment; filename="snaps-${params.id}.csv"`).status(200).send(csv);
      },
    }),
    defineRoute({
      operationId: 'importSnapsCsv',
      method: 'post',
      path: '/film-sessions/{id}/snaps/import',
      summary: 'Import play data for existing snaps from CSV, all or nothing (errors by row and column in error.rows).',
      tags: ['film'],
      access: sessionAccess,
      params: idParams,
      body: snapsCsvImportSchema,
      responses: { 200: { description: 'Count', schema: z.object({ updated: z.number() }) }, 422: { description: 'Bad rows' } },
      handler: async ({ app, params, body, membership }) => importSnapsCsv(app, membership!.teamId, params.id, body.csv),
    }),
    defineRoute({
      operationId: 'tagSnap',
      method: 'patch',
      path: '/snaps/{id}',
      summary: "Edit a snap's play data (Snap Tags).",
      tags: ['film'],
      access: { kind: 'team', roles: staff, team: teamOfSnap },
      params: idParams,
      body: snapTagsUpdateSchema,
      responses: { 200: { description: 'The snap', schema: snapSchema } },
      handler: async ({ app, params, body, membership }) => updateSnapTags(app, membership!.teamId, params.id, body),
    }),
    defineRoute({
      operationId: 'deleteSnap',
      method: 'delete',
      path: '/snaps/{id}',
      summary: 'Delete a snap; its clips stay in the session, unplaced.',
      tags: ['film'],
      access: { kind: 'team', roles: staff, team: teamOfSnap },
      params: idParams,
      responses: { 204: { description: 'Deleted' } },
      handler: async ({ app, params }) => {
        await deleteSnap(app, params.id);
        return new Reply(204);
      },
    }),
    defineRoute({
      operationId: 'getClip',
      method: 'get',
      path: '/clips/{id}',
      summary: 'One clip: state, failure reason, probe facts and its media addresses (players: only clips tagged to or shared with them).',
      tags: ['film'],
      access: clipReaders,
      params: idParams,
      responses: { 200: { description: 'The clip', schema: clipSchema } },
      handler: async ({ app, params, membership }) => {
        await assertClipVisible(app, membership!, params.id);
        return getClip(app, params.id);
      },
    }),
    defineRoute({
      operationId: 'placeClip',
      method: 'patch',
      path: '/clips/{id}',
      summary: 'Attach a clip to a snap of its session (another angle of that play), or detach it.',
      tags: ['film'],
      access: clipAccess,
      params: idParams,
      body: z.object({ snapId: idSchema.nullable() }),
      responses: { 200: { description: 'The clip', schema: clipSchema } },
      handler: async ({ app, params, body }) => {
        const clip = await getClip(app, params.id);
        await placeClip(app, clip.sessionId, params.id, body.snapId);
        return getClip(app, params.id);
      },
    }),
    defineRoute({
      operationId: 'removeClip',
      method: 'delete',
      path: '/clips/{id}',
      summary: 'Remove a clip and delete its stored files.',
      tags: ['film'],
      access: clipAccess,
      params: idParams,
      responses: { 204: { description: 'Removed' } },
      handler: async ({ app, params }) => {
        await removeClip(app, params.id);
        return new Reply(204);
      },
    }),
    defineRoute({
      operationId: 'retryClip',
      method: 'post',
      path: '/clips/{id}/retry',
      summary: 'Process a failed clip again.',
      tags: ['film'],
      access: clipAccess,
      params: idParams,
      responses: { 200: { description: 'The clip', schema: clipSchema } },
      handler: async ({ app, params }) => retryClip(app, params.id),
    }),
    defineRoute({
      operationId: 'detectTapeCuts',
      method: 'post',
      path: '/clips/{id}/detect-cuts',
      summary: 'Propose cut points for a tape again with another scene-change threshold (0.05–0.95).',
      tags: ['film'],
      access: clipAccess,
      params: idParams,
      body: tapeDetectSchema,
      responses: { 200: { description: 'The tape', schema: clipSchema } },
      handler: async ({ app, params, body }) => redetectCuts(app, params.id, body.threshold),
    }),
    defineRoute({
      operationId: 'splitTape',
      method: 'post',
      path: '/clips/{id}/split',
      summary: 'Confirm the cut points of a tape; the worker cuts one snap clip per segment.',
      tags: ['film'],
      access: clipAccess,
      params: idParams,
      body: tapeCutsSchema,
      responses: { 200: { description: 'The tape', schema: clipSchema } },
      handler: async ({ app, params, body }) => confirmCuts(app, params.id, body.cutsMs),
    }),
    mediaRoute('poster', 'The poster frame (JPEG).', 'image/jpeg'),
    mediaRoute('strip', 'The scrub strip: evenly spaced small frames in one row (JPEG); the layout is on the clip.', 'image/jpeg'),
    mediaRoute('playback', 'The web-playable video (MP4, H.264/AAC).', 'video/mp4'),
    defineRoute({
      operationId: 'listTagLists',
      method: 'get',
      path: '/teams/{teamId}/tag-lists',
      summary: "The team's formation, concept, front and outcome lists.",
      tags: ['film'],
      access: { kind: 'team', roles: staff, team: teamFromPath },
      params: teamParams,
      responses: { 200: { description: 'Items', schema: z.object({ items: z.array(tagListItemSchema) }) } },
      handler: async ({ app, params }) => ({ items: await listTagLists(app, params.teamId) }),
    }),
    defineRoute({
      operationId: 'addTagListItem',
      method: 'post',
      path: '/teams/{teamId}/tag-lists',
      summary: 'Add a formation, concept, front or outcome to the team list.',
      tags: ['film'],
      access: { kind: 'team', roles: listEditors, team: teamFromPath },
      params: teamParams,
      body: tagListCreateSchema,
      responses: { 201: { description: 'The item', schema: tagListItemSchema } },
      handler: async ({ app, params, body }) => addTagListItem(app, params.teamId, body.kind, body.name),
    }),
    defineRoute({
      operationId: 'updateTagListItem',
      method: 'patch',
      path: '/teams/{teamId}/tag-lists/{itemId}',
      summary: 'Retire or restore a list item (old snaps keep it).',
      tags: ['film'],
      access: { kind: 'team', roles: listEditors, team: teamFromPath },
      params: z.object({ teamId: idSchema, itemId: idSchema }),
      body: z.object({ active: z.boolean() }),
      responses: { 200: { description: 'The item', schema: tagListItemSchema } },
      handler: async ({ app, params, body }) => setTagListItemActive(app, params.teamId, params.itemId, body.active),
    }),
  ];
}
