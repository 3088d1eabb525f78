import { Injectable, computed, signal } from '@angular/core';
import { DEFAULT_KEY_MAP, GRADE_ACTIONS, RESERVED_KEYS, actionFor, type GradeAction, type KeyMap } from './grade-keys';

const STORAGE_KEY = 'trenchwork.gradeKeyMap.v1';

export type AssignOutcome = { ok: true; movedFrom: GradeAction | null } | { ok: false; reason: string };

/** The coach's key map for the Grading Desk, kept in this browser. */
@Injectable({ providedIn: 'root' })
export class KeyMapStore {
  private readonly stored = signal<KeyMap>(readStored());
  readonly map = this.stored.asReadonly();
  readonly isDefault = computed(() => GRADE_ACTIONS.every((a) => same(this.stored()[a], DEFAULT_KEY_MAP[a])));

  /** Puts `key` on `action`; a key already used elsewhere moves here (each key does one thing). */
  assign(action: GradeAction, key: string): AssignOutcome {
    if (RESERVED_KEYS.includes(key)) return { ok: false, reason: `${key} is kept for moving, digits or the video.` };
    const current = this.stored();
    const owner = actionFor(current, key);
    if (owner === action) return { ok: true, movedFrom: null };
    const next = { ...current };
    if (owner) next[owner] = current[owner].filter((k) => k !== key);
    next[action] = [...current[action], key];
    this.save(next);
    return { ok: true, movedFrom: owner };
  }

  unassign(action: GradeAction, key: string): void {
    const current = this.stored();
    this.save({ ...current, [action]: current[action].filter((k) => k !== key) });
  }

  reset(): void {
    this.stored.set(DEFAULT_KEY_MAP);
    try {
      localStorage.removeItem(STORAGE_KEY);
    } catch {
      // Storage refused: the defaults hold for this tab.
    }
  }

  private save(map: KeyMap): void {
    this.stored.set(map);
    try {
      localStorage.setItem(STORAGE_KEY, JSON.stringify(map));
    } catch {
      // Storage refused (private mode): the map lasts for this tab only.
    }
  }
}

function same(a: readonly string[], b: readonly string[]): boolean {
  return a.length === b.length && a.every((k, i) => k === b[i]);
}

/** A stored map from an older build may lack actions or hold junk; fill gaps with the defaults. */
function readStored(): KeyMap {
  try {
    const raw = JSON.parse(localStorage.getItem(STORAGE_KEY) ?? 'null') as Partial<Record<string, unknown>> | null;
    if (!raw || typeof raw !== 'object') return DEFAULT_KEY_MAP;
    const map = { ...DEFAULT_KEY_MAP };
    for (const action of GRADE_ACTIONS) {
      const keys = raw[action];
      if (Array.isArray(keys) && keys.every((k) => typeof k === 'string' && !RESERVED_KEYS.includes(k))) map[action] = keys as string[];
    }
    return map;
  } catch {
    return DEFAULT_KEY_MAP;
  }
}
