import { snapTitle } from '../study/snap-title';

/** One clip of a cut-up being built, in its place, with the coach's note for it. */
export interface ReelItem {
  clipId: number;
  note: string;
  sessionTitle: string;
  snapOrder: number | null;
  angle: string;
  posterUrl: string | null;
}

/** "Week 2 vs Quarry Bend · Snap 12 · Sideline". */
export function clipLabel(clip: { sessionTitle: string; snapOrder: number | null; angle: string }): string {
  return `${clip.sessionTitle} · ${snapTitle(clip.snapOrder, clip.angle)}`;
}

/** Adds clips at the end, skipping any already in the cut-up. */
export function appendClips(items: readonly ReelItem[], clips: readonly Omit<ReelItem, 'note'>[]): ReelItem[] {
  const present = new Set(items.map((i) => i.clipId));
  const result = [...items];
  for (const c of clips) {
    if (present.has(c.clipId)) continue;
    present.add(c.clipId);
    result.push({ clipId: c.clipId, note: '', sessionTitle: c.sessionTitle, snapOrder: c.snapOrder, angle: c.angle, posterUrl: c.posterUrl });
  }
  return result;
}

/** Moves one item from one place to another (drag and drop, or the up and down buttons). */
export function moveItem<T>(items: readonly T[], from: number, to: number): T[] {
  const list = [...items];
  if (from < 0 || from >= list.length) return list;
  const target = Math.max(0, Math.min(list.length - 1, to));
  const [moved] = list.splice(from, 1);
  list.splice(target, 0, moved);
  return list;
}
