import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { Clip, Snap } from '@shared/api/film';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { createSession, waitForClips } from '../support/film';
import { ffprobeJson, makeClip, makeTape } from '../support/media-fixtures';
import { startTestApp, type TestApp } from '../support/test-app';
import type { ApiClient } from '../support/api-client';

/**
 * The film pipeline through the API and the real worker: upload → probe, poster, strip, rendition;
 * snaps from upload order and a second angle; the contract's clip and snap shapes; media answering
 * Range requests; a tape split at its true cuts; and nothing for another team.
 */
let t: TestApp;
let team: TeamFixture;
let other: TeamFixture;
let analyst: ApiClient;
let dir: string;

beforeAll(async () => {
  t = await startTestApp({ STRIP_FRAMES: '8' });
  await t.startWorker();
  team = await createTeamFixture(t.ctx.db, 'Film');
  other = await createTeamFixture(t.ctx.db, 'Rival');
  analyst = t.client();
  expect((await analyst.login(team.accounts.analyst.email, TEST_PASSWORD)).status).toBe(200);
  dir = await mkdtemp(path.join(tmpdir(), 'tw-film-'));
}, 60_000);

afterAll(async () => {
  await t?.close();
  if (dir) await rm(dir, { recursive: true, force: true });
});

test('POST /api/film-sessions answers 201 with an id, with or without an opponent; bad fields are named', async () => {
  const res = await analyst.post('/api/film-sessions', { teamId: team.teamId, kind: 'game', title: 'Week 1', date: '2026-09-04', opponent: 'Stonebridge' });
  expect(res.status).toBe(201);
  expect(res.body).toMatchObject({ id: expect.any(Number), kind: 'game', title: 'Week 1', seasonId: team.seasonId, snapCount: 0, opponent: 'Stonebridge' });
  // The contract's minimal body: the opponent can be filled in later.
  const minimal = await analyst.post('/api/film-sessions', { teamId: team.teamId, kind: 'game', title: 'Week 2', date: '2026-09-11' });
  expect(minimal.status).toBe(201);
  expect(minimal.body).toMatchObject({ id: expect.any(Number), kind: 'game', opponent: null });
  const bad = await analyst.post('/api/film-sessions', { teamId: team.teamId, kind: 'game', title: '', date: '2026-13-11' });
  expect(bad.status).toBe(422);
  expect(bad.body.error.fields).toEqual(expect.objectContaining({ title: expect.any(String), date: expect.any(String) }));
});

test('the OpenAPI document shows the upload as multipart: angle, kind, then the files', async () => {
  const doc = (await analyst.get('/api/openapi.json')).body;
  const schema = doc.paths['/api/film-sessions/{id}/clips'].post.requestBody.content['multipart/form-data'].schema;
  expect(Object.keys(schema.properties).sort()).toEqual(['angle', 'files', 'kind']);
  expect(schema.properties.angle.enum ?? schema.properties.angle.anyOf?.flatMap((a: { enum?: string[] }) => a.enum ?? [])).toEqual(expect.arrayContaining(['sideline', 'end_zone', 'other']));
  expect(schema.required).toEqual(['files']);
});

describe('per-snap clips from two angles', () => {
  let sessionId: number;
  let sideline: Clip[];
  let endZone: Clip[];

  beforeAll(async () => {
    sessionId = await createSession(analyst, team.teamId);
    // Distinct pictures per file: the same bytes twice would be skipped as a duplicate.
    const wideSources = ['testsrc2', 'mandelbrot', 'rgbtestsrc'] as const;
    const tightSources = ['smptebars', 'smptehdbars', 'testsrc'] as const;
    const wide = await Promise.all(wideSources.map((source, i) => makeClip(dir, { seconds: 2, width: 640, height: 360, fps: 30, audio: true, source, name: `wide-${i + 1}.mp4` })));
    const tight = await Promise.all(tightSources.map((source, i) => makeClip(dir, { seconds: 2, width: 640, height: 360, fps: 30, source, name: `tight-${i + 1}.mp4`, faststart: i !== 1 })));
    const first = await analyst.upload(`/api/film-sessions/${sessionId}/clips`, wide.map((p) => ({ path: p })), { angle: 'sideline' });
    expect(first.status).toBe(201);
    expect(first.body.clips).toHaveLength(3);
    const second = await analyst.upload(`/api/film-sessions/${sessionId}/clips`, tight.map((p) => ({ path: p })), { angle: 'end_zone' });
    expect(second.status).toBe(201);
    const ids = [...first.body.clips, ...second.body.clips].map((c: { id: number }) => c.id);
    const done = await waitForClips(analyst, sessionId, { ids, timeoutMs: 90_000 });
    sideline = done.filter((c) => c.angle === 'sideline');
    endZone = done.filter((c) => c.angle === 'end_zone');
  }, 120_000);

  test('every clip ends ready with the facts ffprobe reports', async () => {
    for (const clip of [...sideline, ...endZone]) {
      expect(clip).toMatchObject({ status: 'ready', failureReason: null, width: 640, height: 360, fps: 30 });
      expect(clip.durationMs).toBeGreaterThanOrEqual(1900);
      expect(clip.durationMs).toBeLessThanOrEqual(2100);
    }
  });

  test('GET /api/clips/{id} has exactly the contract fields', async () => {
    const res = await analyst.get(`/api/clips/${sideline[0]!.id}`);
    expect(res.status).toBe(200);
    for (const field of ['id', 'status', 'failureReason', 'durationMs', 'width', 'height', 'fps', 'posterUrl', 'playbackUrl', 'snapId']) expect(res.body).toHaveProperty(field);
    expect(res.body.posterUrl).toBe(`/api/clips/${sideline[0]!.id}/poster`);
  });

  test('the poster is a JPEG and the playback answers 206 to a Range request with a web MP4', async () => {
    const clip = sideline[0]!;
    const poster = await analyst.agent.get(clip.posterUrl!).buffer(true);
    expect(poster.status).toBe(200);
    expect(poster.headers['content-type']).toBe('image/jpeg');
    expect(poster.body.subarray(0, 3)).toEqual(Buffer.from([0xff, 0xd8, 0xff]));
    const part = await analyst.agent.get(clip.playbackUrl!).set('Range', 'bytes=0-1023').buffer(true);
    expect(part.status).toBe(206);
    expect(part.headers['content-type']).toBe('video/mp4');
    expect(part.headers['content-range']).toMatch(/^bytes 0-1023\/\d+$/);
    expect(part.body.length).toBe(1024);
    const whole = await analyst.agent.get(clip.playbackUrl!).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    const file = path.join(dir, 'downloaded.mp4');
    await (await import('node:fs/promises')).writeFile(file, whole.body as Buffer);
    const probe = await ffprobeJson(file);
    const video = probe.streams.find((s: { codec_type: string }) => s.codec_type === 'video');
    expect(video.codec_name).toBe('h264');
    expect(video.pix_fmt).toBe('yuv420p');
  });

  test('the strip layout has the configured frame count and matches the poster aspect', async () => {
    const clip = sideline[1]!;
    expect(clip.strip).toMatchObject({ frames: 8, tileWidth: 160, tileHeight: 90 });
    expect(clip.strip!.intervalMs).toBeGreaterThan(0);
    const strip = await analyst.agent.get(clip.stripUrl!).buffer(true);
    expect(strip.status).toBe(200);
    expect(strip.headers['content-type']).toBe('image/jpeg');
  });

  test('snaps follow upload order and the end-zone clips join the same snaps', async () => {
    const res = await analyst.get(`/api/film-sessions/${sessionId}/snaps`);
    expect(res.status).toBe(200);
    const snaps = res.body.snaps as Snap[];
    expect(snaps.map((s) => s.order)).toEqual([1, 2, 3]);
    for (const snap of snaps) {
      expect(snap.clips.map((c) => c.angle).sort()).toEqual(['end_zone', 'sideline']);
      expect(snap).toHaveProperty('personnel');
      expect(snap).toHaveProperty('frontId');
    }
    const bySnap = (clips: Clip[]) => clips.sort((a, b) => a.id - b.id).map((c) => snaps.find((s) => s.id === c.snapId)!.order);
    expect(bySnap(sideline)).toEqual([1, 2, 3]);
    expect(bySnap(endZone)).toEqual([1, 2, 3]);
  });

  test('the same file twice in the session is reported and skipped', async () => {
    const again = path.join(dir, 'wide-1.mp4');
    const res = await analyst.upload(`/api/film-sessions/${sessionId}/clips`, [{ path: again, name: 'renamed-copy.mp4' }], { angle: 'sideline' });
    expect(res.status).toBe(201);
    expect(res.body.clips).toEqual([]);
    expect(res.body.skipped).toEqual([{ originalName: 'renamed-copy.mp4', reason: 'the same file is already in this session', duplicateOfClipId: expect.any(Number) }]);
  });

  test('play data: tags save with field errors for bad values; bulk tags a range', async () => {
    const lists = (await analyst.get(`/api/teams/${team.teamId}/tag-lists`)).body.items as { id: number; kind: string; name: string }[];
    const power = lists.find((i) => i.kind === 'concept' && i.name === 'power')!;
    const under = lists.find((i) => i.kind === 'front' && i.name === 'under')!;
    const snaps = (await analyst.get(`/api/film-sessions/${sessionId}/snaps`)).body.snaps as Snap[];
    const ok = await analyst.patch(`/api/snaps/${snaps[0]!.id}`, { quarter: 1, down: 2, distance: 7, yardLine: 35, fieldSide: 'own', hash: 'left', personnel: '12', conceptId: power.id, frontId: under.id, direction: 'right', resultYards: 4 });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ quarter: 1, down: 2, distance: 7, personnel: '12', conceptId: power.id, frontId: under.id });
    const bad = await analyst.patch(`/api/snaps/${snaps[0]!.id}`, { personnel: '7', down: 5, frontId: power.id });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['down', 'personnel']);
    const wrongList = await analyst.patch(`/api/snaps/${snaps[0]!.id}`, { frontId: power.id });
    expect(wrongList.status).toBe(422);
    expect(wrongList.body.error.fields).toHaveProperty('frontId');
    const bulk = await analyst.post(`/api/film-sessions/${sessionId}/snaps/bulk-tags`, { snapIds: snaps.map((s) => s.id), tags: { quarter: 2 } });
    expect(bulk.status).toBe(200);
    expect((bulk.body.snaps as Snap[]).map((s) => s.quarter)).toEqual([2, 2, 2]);
  });

  test('play data CSV round-trips, and a bad file imports nothing', async () => {
    const csv = (await analyst.agent.get(`/api/film-sessions/${sessionId}/snaps/export.csv`)).text;
    expect(csv.split('\n')[0]).toBe('snap,quarter,down,distance,yard_line,side,hash,personnel,formation,concept,direction,front,gain,outcome,period,notes');
    const changed = csv.replace(/\n1,2,2,7,/, '\n1,3,3,1,');
    const res = await analyst.post(`/api/film-sessions/${sessionId}/snaps/import`, { csv: changed });
    expect(res.status).toBe(200);
    expect(res.body.updated).toBe(3);
    const first = ((await analyst.get(`/api/film-sessions/${sessionId}/snaps`)).body.snaps as Snap[])[0]!;
    expect(first).toMatchObject({ quarter: 3, down: 3, distance: 1 });
    const broken = 'snap,down,front\n1,2,over\n2,9,over\n7,1,nonsense\n';
    const refused = await analyst.post(`/api/film-sessions/${sessionId}/snaps/import`, { csv: broken });
    expect(refused.status).toBe(422);
    expect(refused.body.error.rows.map((r: { row: number; field: string }) => `${r.row}:${r.field}`)).toEqual(['3:down', '4:snap']);
    const after = ((await analyst.get(`/api/film-sessions/${sessionId}/snaps`)).body.snaps as Snap[])[0]!;
    expect(after.down).toBe(3);
  });

  test('a member of another team can neither list nor fetch these clips or their media', async () => {
    const stranger = t.client();
    expect((await stranger.login(other.accounts.admin.email, TEST_PASSWORD)).status).toBe(200);
    const clip = sideline[0]!;
    for (const url of [`/api/film-sessions/${sessionId}/clips`, `/api/film-sessions/${sessionId}/snaps`, `/api/clips/${clip.id}`, clip.posterUrl!, clip.playbackUrl!, clip.stripUrl!]) {
      const res = await stranger.get(url);
      expect([url, res.status]).toEqual([url, 403]);
    }
    const listed = await stranger.get(`/api/film-sessions?teamId=${team.teamId}`);
    expect(listed.status).toBe(403);
    const anonymous = await request(t.app).get(clip.playbackUrl!);
    expect(anonymous.status).toBe(401);
    const player = t.client();
    expect((await player.login(team.accounts.player.email, TEST_PASSWORD)).status).toBe(200);
    // A clip not tagged to or shared with the player does not exist for him.
    expect((await player.get(clip.posterUrl!)).status).toBe(404);
    expect((await player.get(`/api/clips/${clip.id}`)).status).toBe(404);
  });
});

describe('a continuous tape', () => {
  test('proposed cuts fall within 2 frames of the true cuts; the split makes one ready snap clip per segment', async () => {
    const sessionId = await createSession(analyst, team.teamId, { kind: 'practice', title: 'Tuesday team run', opponent: null, periods: ['team run'] });
    const tape = await makeTape(
      dir,
      [
        { seconds: 2, source: 'testsrc2' },
        { seconds: 2, source: 'smptebars' },
        { seconds: 1.5, source: 'mandelbrot' },
        { seconds: 2, source: 'color=c=navy' },
      ],
      { width: 480, height: 270, fps: 25, name: 'practice-tape.mp4' },
    );
    const up = await analyst.upload(`/api/film-sessions/${sessionId}/clips`, [{ path: tape.path }], { angle: 'sideline', kind: 'tape' });
    expect(up.status).toBe(201);
    const [ready] = await waitForClips(analyst, sessionId, { ids: [up.body.clips[0].id], timeoutMs: 90_000 });
    expect(ready!.status).toBe('ready');
    const proposed = ready!.proposedCutsMs!;
    const frameMs = 1000 / tape.fps;
    expect(proposed).toHaveLength(tape.cuts.length);
    tape.cuts.forEach((cut, i) => expect(Math.abs(proposed[i]! - cut * 1000)).toBeLessThanOrEqual(2 * frameMs));

    const split = await analyst.post(`/api/clips/${ready!.id}/split`, { cutsMs: proposed });
    expect(split.status).toBe(200);
    const deadline = Date.now() + 120_000;
    let pieces: Clip[] = [];
    while (Date.now() < deadline) {
      const clips = (await analyst.get(`/api/film-sessions/${sessionId}/clips`)).body.clips as Clip[];
      pieces = clips.filter((c) => c.kind === 'snap');
      if (pieces.length === 4 && pieces.every((c) => c.status === 'ready' || c.status === 'failed')) break;
      await new Promise((r) => setTimeout(r, 400));
    }
    expect(pieces.map((c) => c.status)).toEqual(['ready', 'ready', 'ready', 'ready']);
    const expected = [2000, 2000, 1500, 2000];
    pieces.forEach((c, i) => expect(Math.abs(c.durationMs! - expected[i]!)).toBeLessThanOrEqual(2 * frameMs + 30));
    const snaps = (await analyst.get(`/api/film-sessions/${sessionId}/snaps`)).body.snaps as Snap[];
    expect(snaps.map((s) => s.clips.length)).toEqual([1, 1, 1, 1]);
    const tooClose = await analyst.post(`/api/clips/${ready!.id}/split`, { cutsMs: [100] });
    expect([409, 422]).toContain(tooClose.status);
  }, 180_000);
});
