/** The player film room: kinds of coaching points, position groups for sharing, watched coverage. */
export const POINT_KINDS = ['praise', 'correction', 'teaching'] as const;
export type PointKind = (typeof POINT_KINDS)[number];
export const COMMENT_KINDS = [...POINT_KINDS, 'question', 'reply'] as const;
export type CommentKind = (typeof COMMENT_KINDS)[number];
export const COMMENT_KIND_LABELS: Record<CommentKind, string> = {
  praise: 'Keep doing this',
  correction: 'Fix this',
  teaching: 'Teaching point',
  question: 'Question',
  reply: 'Reply',
};

export const POSITION_GROUPS = ['OL', 'TE', 'LT', 'LG', 'C', 'RG', 'RT'] as const;
export type PositionGroup = (typeof POSITION_GROUPS)[number];
export const POSITION_GROUP_LABELS: Record<PositionGroup, string> = {
  OL: 'Offensive line',
  TE: 'Tight ends',
  LT: 'Left tackles',
  LG: 'Left guards',
  C: 'Centers',
  RG: 'Right guards',
  RT: 'Right tackles',
};

/** Whether a player whose roster positions are `positions` belongs to a group. */
export function inPositionGroup(group: PositionGroup, positions: readonly string[]): boolean {
  if (group === 'OL') return positions.some((p) => ['LT', 'LG', 'C', 'RG', 'RT'].includes(p));
  return positions.includes(group);
}

/**
 * Merges played ranges [from, to] (ms) into the fewest disjoint ranges, clipped to [0, duration],
 * so replaying a moment does not count twice. Answers the ranges and how many ms they cover.
 */
export function mergeWatched(ranges: readonly [number, number][], durationMs: number): { ranges: [number, number][]; coveredMs: number } {
  const clipped = ranges
    .map(([a, b]) => [Math.max(0, Math.min(a, b)), Math.min(durationMs, Math.max(a, b))] as [number, number])
    .filter(([a, b]) => b > a)
    .sort((x, y) => x[0] - y[0]);
  const merged: [number, number][] = [];
  for (const [a, b] of clipped) {
    const last = merged[merged.length - 1];
    if (last && a <= last[1]) last[1] = Math.max(last[1], b);
    else merged.push([a, b]);
  }
  return { ranges: merged, coveredMs: merged.reduce((sum, [a, b]) => sum + (b - a), 0) };
}
