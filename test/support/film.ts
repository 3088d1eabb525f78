import type { Clip } from '@shared/api/film';
import type { ApiClient } from './api-client';

/** Film helpers for integration tests: a session through the API, and waiting for the worker. */
export async function createSession(client: ApiClient, teamId: number, over: Record<string, unknown> = {}): Promise<number> {
  const res = await client.post('/api/film-sessions', { teamId, kind: 'game', title: 'Week 3 vs Hollow Creek', date: '2026-09-18', opponent: 'Hollow Creek', week: 3, ...over });
  if (res.status !== 201) throw new Error(`createSession: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.id as number;
}

const FINAL = new Set(['ready', 'failed']);

/** Polls the session's clips until every one (or those in `ids`) is ready or failed. */
export async function waitForClips(client: ApiClient, sessionId: number, options: { ids?: number[]; count?: number; timeoutMs?: number } = {}): Promise<Clip[]> {
  const deadline = Date.now() + (options.timeoutMs ?? 60_000);
  for (;;) {
    const res = await client.get(`/api/film-sessions/${sessionId}/clips`);
    const clips = (res.body.clips ?? []) as Clip[];
    const watched = options.ids ? clips.filter((c) => options.ids!.includes(c.id)) : clips;
    const enough = options.count === undefined || watched.length >= options.count;
    if (enough && watched.length > 0 && watched.every((c) => FINAL.has(c.status))) return watched;
    if (Date.now() > deadline) throw new Error(`clips not final in time: ${JSON.stringify(watched.map((c) => [c.id, c.status, c.progress]))}`);
    await new Promise((r) => setTimeout(r, 300));
  }
}
