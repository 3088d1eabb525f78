/** One line of a shortcut list: the keys (any of them works) and what they do. */
export interface Shortcut {
  keys: readonly string[];
  action: string;
}

export interface ShortcutGroup {
  title: string;
  shortcuts: readonly Shortcut[];
}

const TEXT_INPUT_TYPES = new Set(['text', 'search', 'number', 'email', 'password', 'tel', 'url', 'date', 'time', 'datetime-local', 'month', 'week']);

/** Whether a key press lands where the user is typing or choosing (fields, selects, open menus). */
export function isTypingTarget(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (target.closest('.cdk-overlay-container')) return true;
  if (target.isContentEditable) return true;
  if (target instanceof HTMLTextAreaElement || target instanceof HTMLSelectElement) return true;
  if (target instanceof HTMLInputElement) return TEXT_INPUT_TYPES.has(target.type);
  return target.closest('mat-select, [role=combobox]') !== null;
}

/**
 * Whether a page-wide single-key shortcut may act on this key press: nobody handled it yet, no
 * browser or system modifier is held, and the user is not typing into a field or a dialog.
 */
export function isPageShortcut(event: KeyboardEvent): boolean {
  if (event.defaultPrevented || event.ctrlKey || event.metaKey || event.altKey || event.isComposing) return false;
  return !isTypingTarget(event.target);
}

/** Buttons answer Space and Enter themselves; a shortcut on those keys must let them. */
export function isButtonTarget(target: EventTarget | null): boolean {
  return target instanceof HTMLElement && target.closest('button, a[href], [role=button], [role=option]') !== null;
}
