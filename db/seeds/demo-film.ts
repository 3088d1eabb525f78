import { execFile } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import type { Database } from '../database';
import type { Config } from '../../server/core/config';
import { objectKeys } from '../../server/core/object-keys';
import { createJobQueue, type JobQueue } from '../../server/core/queue';
import { jobPolicies } from '../../server/core/jobs';
import { createObjectStorage } from '../../server/core/storage';

const run = promisify(execFile);

// Invented test pictures from ffmpeg's own sources: no real footage anywhere.
const SOURCES = ['testsrc2', 'smptebars', 'mandelbrot', 'rgbtestsrc', 'testsrc', 'smptehdbars', 'color=c=0x2E6B4F', 'color=c=0x1F2A36'];

const POINTS = [
  { kind: 'correction', component: 'padLevel', atMs: 800, endMs: 2200, body: 'You pop up out of your stance. Stay low through the first two steps.' },
  { kind: 'praise', component: 'hands', atMs: 1500, body: 'Great punch: thumbs up, inside the frame. That is the target.' },
  { kind: 'teaching', component: 'footwork', atMs: 600, body: 'Against the 3 technique your first step is a 6-inch bucket step. Watch the near foot.' },
] as const;

/**
 * The demo's film: short generated clips for the last game's first snaps (processed by the worker
 * when it starts), a week of coaching points for two linemen, a cut-up shared with the line, and a
 * digest queued for the demo player, so the Study Queue and the mailbox have something to show.
 * Skipped (with a note) when no object store or ffmpeg is reachable.
 */
export async function seedDemoFilm(db: Database, config: Config, teamId: number, coachId: number, playerIds: { player: number; other: number }): Promise<string> {
  const storage = createObjectStorage(config);
  let queue: JobQueue | undefined;
  const dir = await mkdtemp(path.join(tmpdir(), 'tw-demo-film-'));
  try {
    await storage.ensureBucket();
    const session = await db.selectFrom('film_sessions').select(['id']).where('team_id', '=', teamId).where('kind', '=', 'game').orderBy('date', 'desc').limit(1).executeTakeFirst();
    if (!session) return 'no game to attach film to';
    const snaps = await db.selectFrom('snaps').select(['id', 'order']).where('session_id', '=', session.id).orderBy('order').limit(SOURCES.length).execute();
    queue = createJobQueue(config.databaseUrl, { policies: jobPolicies(config.media.timeoutMs), max: 2 });
    await queue.start();
    // Make every file first, so a failure leaves no half-seeded film behind.
    const files: string[] = [];
    for (const [i, snap] of snaps.entries()) {
      const file = path.join(dir, `snap-${snap.order}.mp4`);
      const source = SOURCES[i]!;
      await run(config.ffmpegPath, [
        '-nostdin', '-hide_banner', '-loglevel', 'error', '-y',
        '-f', 'lavfi', '-i', `${source}${source.includes('=') ? ':' : '='}size=640x360:rate=30`,
        '-f', 'lavfi', '-i', 'sine=frequency=220',
        '-t', '4', '-c:v', 'libx264', '-preset', 'veryfast', '-pix_fmt', 'yuv420p', '-c:a', 'aac', '-movflags', '+faststart', file,
      ]);
      files.push(file);
    }
    const clipIds: number[] = [];
    for (const [i, snap] of snaps.entries()) {
      const bytes = await readFile(files[i]!);
      const key = objectKeys.original(teamId, session.id);
      await storage.upload(key, bytes, 'video/mp4').done;
      const clip = await db.transaction().execute(async (trx) => {
        const row = await trx
          .insertInto('clips')
          .values({
            team_id: teamId, session_id: session.id, snap_id: snap.id, kind: 'snap', angle: 'sideline', upload_order: i + 1,
            original_name: `week6-snap${snap.order}.mp4`, status: 'received', sha256: createHash('sha256').update(bytes).digest('hex'),
            size_bytes: bytes.length, original_key: key, created_by: coachId,
          })
          .returning('id')
          .executeTakeFirstOrThrow();
        await queue!.send('clip.process', { clipId: row.id }, trx);
        return row.id;
      });
      clipIds.push(clip);
    }
    // A week of coaching points: three for the demo player, two for his neighbour.
    const targets = [playerIds.player, playerIds.player, playerIds.player, playerIds.other, playerIds.other];
    for (const [i, playerId] of targets.entries()) {
      const point = POINTS[i % POINTS.length]!;
      const comment = await db
        .insertInto('clip_comments')
        .values({ team_id: teamId, clip_id: clipIds[i]!, author_id: coachId, at_ms: point.atMs, end_ms: 'endMs' in point ? point.endMs : null, kind: point.kind, component: point.component, body: point.body })
        .returning('id')
        .executeTakeFirstOrThrow();
      await db.insertInto('comment_targets').values({ comment_id: comment.id, player_id: playerId }).execute();
    }
    const cutup = await db.insertInto('cutups').values({ team_id: teamId, title: 'Week 6: first steps against the 3 technique', description: 'Watch the near foot on every rep.', created_by: coachId }).returning('id').executeTakeFirstOrThrow();
    await db.insertInto('cutup_items').values(clipIds.slice(0, 4).map((clip_id, i) => ({ cutup_id: cutup.id, position: i + 1, clip_id, note: i === 0 ? 'Bucket step, then hands.' : null }))).execute();
    await db.insertInto('cutup_shares').values({ cutup_id: cutup.id, position_group: 'OL', player_id: null }).execute();
    // The digest goes as soon as the worker runs.
    await queue.send('digest.coaching', { playerId: playerIds.player }, undefined, { singletonKey: `digest:${playerIds.player}`, singletonSeconds: 3600 });
    return `${clipIds.length} clips queued for processing, ${targets.length} coaching points, 1 shared cut-up`;
  } catch (error) {
    return `film skipped (${(error as Error).message.split('\n')[0]})`;
  } finally {
    await queue?.stop().catch(() => undefined);
    storage.destroy();
    await rm(dir, { recursive: true, force: true });
  }
}
