/**
 * Which snap each uploaded clip belongs to. A batch whose every file name carries a distinct play
 * number (the last group of digits, 1–999: "play_012.mp4" → 12) is placed by those numbers;
 * otherwise clips fill snaps in upload order. Either way a clip joins a snap that does not yet
 * have its angle, so a second angle uploaded later lines up with the first.
 */
export function playNumberFromName(name: string): number | null {
  const base = name.replace(/\.[A-Za-z0-9]{1,5}$/, '');
  const groups = base.match(/\d+/g);
  if (!groups) return null;
  const n = Number(groups[groups.length - 1]);
  return n >= 1 && n <= 999 ? n : null;
}

export function batchPlayNumbers(names: string[]): (number | null)[] {
  const numbers = names.map(playNumberFromName);
  const usable = numbers.every((n) => n !== null) && new Set(numbers).size === numbers.length;
  return usable ? numbers : names.map(() => null);
}

export interface SnapSlot {
  id: number;
  order: number;
  angles: Set<string>;
}

export type Placement = { snapId: number } | { newOrder: number };

/** Plans each clip's snap: an existing snap id, or the order of a snap to create. Pure, for tests. */
export function planPlacements(existing: SnapSlot[], clips: { angle: string; playNumber: number | null }[]): Placement[] {
  const slots = existing.map((s) => ({ ...s, angles: new Set(s.angles) })).sort((a, b) => a.order - b.order);
  const created = new Map<number, Set<string>>();
  let maxOrder = slots.reduce((m, s) => Math.max(m, s.order), 0);
  const take = (order: number, angle: string): Placement | null => {
    const slot = slots.find((s) => s.order === order);
    if (slot) {
      if (slot.angles.has(angle)) return null;
      slot.angles.add(angle);
      return { snapId: slot.id };
    }
    const planned = created.get(order);
    if (planned) {
      if (planned.has(angle)) return null;
      planned.add(angle);
      return { newOrder: order };
    }
    created.set(order, new Set([angle]));
    maxOrder = Math.max(maxOrder, order);
    return { newOrder: order };
  };
  return clips.map(({ angle, playNumber }) => {
    if (playNumber !== null) {
      const placed = take(playNumber, angle);
      if (placed) return placed;
    }
    const orders = [...slots.map((s) => s.order), ...created.keys()].sort((a, b) => a - b);
    for (const order of orders) {
      const placed = take(order, angle);
      if (placed) return placed;
    }
    return take(maxOrder + 1, angle)!;
  });
}
