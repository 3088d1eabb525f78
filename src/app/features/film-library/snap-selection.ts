/** Which snaps are selected for tagging; the focus snap is the one in the player. */
export interface SnapSelection {
  anchorId: number | null;
  focusId: number | null;
  /** In snap order. */
  ids: readonly number[];
}

export type PickMode = 'only' | 'range' | 'toggle';

export const NO_SELECTION: SnapSelection = { anchorId: null, focusId: null, ids: [] };

/** Click (only), shift-click (range from the anchor) or ctrl/⌘-click (toggle) on a snap. */
export function pickSnap(order: readonly number[], current: SnapSelection, id: number, mode: PickMode): SnapSelection {
  if (!order.includes(id)) return current;
  if (mode === 'range') {
    const anchor = current.anchorId !== null && order.includes(current.anchorId) ? current.anchorId : id;
    const [from, to] = [order.indexOf(anchor), order.indexOf(id)].sort((a, b) => a - b);
    return { anchorId: anchor, focusId: id, ids: order.slice(from, to + 1) };
  }
  if (mode === 'toggle') {
    const chosen = new Set(current.ids);
    if (chosen.has(id) && chosen.size > 1) chosen.delete(id);
    else chosen.add(id);
    const ids = order.filter((snapId) => chosen.has(snapId));
    return { anchorId: id, focusId: chosen.has(id) ? id : ids[0], ids };
  }
  return { anchorId: id, focusId: id, ids: [id] };
}

/** Next/previous snap (J/K, ↓/↑); with Shift the range grows from the anchor. */
export function stepSelection(order: readonly number[], current: SnapSelection, delta: number, extend: boolean): SnapSelection {
  if (order.length === 0) return current;
  const from = current.focusId !== null && order.includes(current.focusId) ? order.indexOf(current.focusId) : delta > 0 ? -1 : order.length;
  const index = Math.min(order.length - 1, Math.max(0, from + delta));
  return pickSnap(order, current, order[index], extend ? 'range' : 'only');
}
