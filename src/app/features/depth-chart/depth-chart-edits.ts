import { POSITIONS, type Position } from '@shared/roster';

/** The depth chart being edited: each position's candidates as player ids, starter first. */
export type ChartDraft = Record<Position, readonly number[]>;

/** The API takes at most this many candidates at a position (depthChartInputSchema). */
export const MAX_PER_POSITION = 8;

export type EditResult = { ok: true; draft: ChartDraft } | { ok: false; problem: string };

export function emptyDraft(): ChartDraft {
  return Object.fromEntries(POSITIONS.map((p) => [p, []])) as unknown as ChartDraft;
}

export function draftFrom(positions: Partial<Record<string, readonly { playerId: number }[]>>): ChartDraft {
  return Object.fromEntries(POSITIONS.map((p) => [p, (positions[p] ?? []).map((c) => c.playerId)])) as unknown as ChartDraft;
}

const clampIndex = (index: number, length: number) => Math.max(0, Math.min(index, length));

function withList(draft: ChartDraft, position: Position, list: readonly number[]): ChartDraft {
  return { ...draft, [position]: list };
}

/** Moves the candidate at `from` to `to` within one position (a drag inside a column, or ↑/↓). */
export function reorder(draft: ChartDraft, position: Position, from: number, to: number): ChartDraft {
  const list = [...draft[position]];
  if (from < 0 || from >= list.length) return draft;
  const [player] = list.splice(from, 1);
  list.splice(clampIndex(to, list.length), 0, player);
  return withList(draft, position, list);
}

/**
 * Puts the candidate at `from`/`fromIndex` into `to` at `toIndex`. `move` takes him off the first
 * position; `copy` keeps him at both (a swing player listed at guard and tackle).
 */
export function transfer(draft: ChartDraft, from: Position, fromIndex: number, to: Position, toIndex: number, mode: 'move' | 'copy', name = 'That player'): EditResult {
  const player = draft[from][fromIndex];
  if (player === undefined) return { ok: false, problem: 'Nothing to move there.' };
  if (from === to) return { ok: true, draft: reorder(draft, from, fromIndex, toIndex) };
  if (draft[to].includes(player)) return { ok: false, problem: `${name} is already listed at ${to}.` };
  if (draft[to].length >= MAX_PER_POSITION) return { ok: false, problem: `${to} already has ${MAX_PER_POSITION} candidates, the most a position can list.` };
  const target = [...draft[to]];
  target.splice(clampIndex(toIndex, target.length), 0, player);
  let next = withList(draft, to, target);
  if (mode === 'move') next = withList(next, from, draft[from].filter((_, i) => i !== fromIndex));
  return { ok: true, draft: next };
}

/** Adds a roster player at the bottom of a position. */
export function addCandidate(draft: ChartDraft, position: Position, playerId: number, name = 'That player'): EditResult {
  if (draft[position].includes(playerId)) return { ok: false, problem: `${name} is already listed at ${position}.` };
  if (draft[position].length >= MAX_PER_POSITION) return { ok: false, problem: `${position} already has ${MAX_PER_POSITION} candidates, the most a position can list.` };
  return { ok: true, draft: withList(draft, position, [...draft[position], playerId]) };
}

export function removeCandidate(draft: ChartDraft, position: Position, index: number): ChartDraft {
  return withList(draft, position, draft[position].filter((_, i) => i !== index));
}

/** The positions whose order differs from the saved chart: what the PUT sends (it replaces only those). */
export function changedPositions(saved: ChartDraft, draft: ChartDraft): Partial<Record<Position, number[]>> {
  const out: Partial<Record<Position, number[]>> = {};
  for (const p of POSITIONS) {
    const a = saved[p];
    const b = draft[p];
    if (a.length !== b.length || a.some((id, i) => id !== b[i])) out[p] = [...b];
  }
  return out;
}
