import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, input, linkedSignal, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom, map, type Observable } from 'rxjs';
import type { Snap, TagListItem } from '@shared/api/film';
import { PERSONNEL_PATTERN, describePersonnel, type TagListKind } from '@shared/film';
import { readApiError } from '../../core/http/api-error';
import { isButtonTarget, isPageShortcut, isTypingTarget } from '../snap-player/shortcut-keys';
import { ShortcutList } from '../snap-player/shortcut-list';
import { FilmApi } from './film-api';
import { BLANK_DRAFT, TAG_FIELDS, TagDraft, TagErrors, TagField, changedTags, draftFromSnap } from './tag-draft';
import { CYCLES, FIELD_KEYS, TAG_KEYS, TAG_SHORTCUTS, nextInCycle } from './tag-keys';

type ListField = 'formationId' | 'conceptId' | 'frontId' | 'outcomeId';
const LIST_FIELDS: Record<ListField, TagListKind> = { formationId: 'formation', conceptId: 'concept', frontId: 'front', outcomeId: 'outcome' };

const CYCLE_LABELS: Record<keyof typeof CYCLES, string> = { quarter: 'Quarter', hash: 'Hash', direction: 'Direction', fieldSide: 'Side' };

function sameDraft(a: TagDraft, b: TagDraft): boolean {
  return TAG_FIELDS.every((field) => a[field] === b[field]);
}

function rangeLabel(snaps: readonly Snap[]): string {
  const orders = snaps.map((s) => s.order).sort((a, b) => a - b);
  const contiguous = orders.every((o, i) => i === 0 || o === orders[i - 1] + 1);
  return contiguous ? `${orders[0]}–${orders[orders.length - 1]}` : orders.join(', ');
}

/**
 * Snap Tags: the play data of the selected snap, or of several snaps at once (only the fields
 * changed are applied to all). Built for the keyboard: see TAG_KEYS.
 */
@Component({
  selector: 'tw-snap-tags-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ShortcutList],
  templateUrl: './snap-tags-panel.html',
  styleUrl: './snap-tags-panel.scss',
  host: { '(document:keydown)': 'onKey($event)' },
})
export class SnapTagsPanel {
  readonly sessionId = input.required<number>();
  /** The selected snaps in order; one snap is edited as itself, several get bulk tags. */
  readonly targets = input.required<readonly Snap[]>();
  readonly periods = input<readonly string[]>([]);
  readonly tagItems = input<readonly TagListItem[]>([]);
  /** Snaps as the server now has them after a save. */
  readonly saved = output<readonly Snap[]>();

  private readonly api = inject(FilmApi);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  protected readonly keys = FIELD_KEYS;
  protected readonly shortcutGroups = [TAG_SHORTCUTS];
  protected readonly quarters = [1, 2, 3, 4, 5];
  protected readonly downs = [1, 2, 3, 4];

  private readonly targetKey = computed(() => this.targets().map((s) => s.id).join(','));
  protected readonly bulk = computed(() => this.targets().length > 1);
  protected readonly heading = computed(() => {
    const snaps = this.targets();
    if (snaps.length === 0) return 'No snap selected';
    return snaps.length === 1 ? `Snap ${snaps[0].order}` : `${snaps.length} snaps (${rangeLabel(snaps)})`;
  });
  /** The server's copy after our save, until the page passes that snap in again. */
  private readonly savedCopy = linkedSignal<string, { replaces: Snap; snap: Snap } | null>({ source: this.targetKey, computation: () => null });
  private readonly base = computed(() => {
    const snaps = this.targets();
    if (snaps.length !== 1) return BLANK_DRAFT;
    const saved = this.savedCopy();
    return draftFromSnap(saved && saved.replaces === snaps[0] ? saved.snap : snaps[0]);
  });
  private readonly basis = computed(() => ({ key: this.targetKey(), draft: this.base() }));

  /** What the form shows. A new server copy of the same snap replaces it only if nothing was typed. */
  protected readonly draft = linkedSignal<{ key: string; draft: TagDraft }, TagDraft>({
    source: this.basis,
    computation: (next, previous) => {
      if (!previous || previous.source.key !== next.key) return next.draft;
      return sameDraft(previous.value, previous.source.draft) ? next.draft : previous.value;
    },
  });
  /** Bulk edits send the fields touched, even when cleared. */
  private readonly touched = linkedSignal<string, ReadonlySet<TagField>>({ source: this.targetKey, computation: () => new Set() });
  private readonly serverErrors = linkedSignal<string, TagErrors>({ source: this.targetKey, computation: () => ({}) });
  private readonly attempted = linkedSignal({ source: this.targetKey, computation: () => false });
  protected readonly justSaved = linkedSignal({ source: this.targetKey, computation: () => false });
  protected readonly problem = linkedSignal<string, string | null>({ source: this.targetKey, computation: () => null });
  protected readonly saving = signal(false);
  protected readonly announcement = signal('');

  private readonly pending = computed(() => changedTags(this.draft(), this.base(), this.bulk() ? this.touched() : new Set()));
  protected readonly hasChanges = computed(() => Object.keys(this.pending().update).length > 0);
  protected readonly errors = computed<TagErrors>(() => ({ ...(this.attempted() ? this.pending().errors : {}), ...this.serverErrors() }));

  protected readonly personnelHint = computed(() => {
    const code = this.draft().personnel.trim();
    return PERSONNEL_PATTERN.test(code) ? describePersonnel(code) : 'Backs, then tight ends: 11, 12, 21…';
  });

  /** Active list items, plus a retired one the snap already carries. */
  protected readonly options = computed(() => {
    const items = this.tagItems();
    const current = this.bulk() ? null : (this.targets()[0] ?? null);
    const pick = (field: ListField) =>
      items
        .filter((item) => item.kind === LIST_FIELDS[field] && (item.active || current?.[field] === item.id))
        .map((item) => ({ id: item.id, label: item.active ? item.name : `${item.name} (retired)` }));
    return { formationId: pick('formationId'), conceptId: pick('conceptId'), frontId: pick('frontId'), outcomeId: pick('outcomeId') };
  });

  protected readonly periodOptions = computed(() => {
    const list = [...this.periods()];
    const current = this.bulk() ? null : this.targets()[0]?.period;
    if (current && !list.includes(current)) list.push(current);
    return list;
  });

  protected set<F extends TagField>(field: F, value: TagDraft[F]): void {
    this.draft.update((draft) => ({ ...draft, [field]: value }));
    this.touched.update((set) => new Set(set).add(field));
    this.serverErrors.update((errors) => {
      const { [field]: _dropped, ...rest } = errors;
      return rest;
    });
    this.justSaved.set(false);
    this.problem.set(null);
  }

  protected setText(field: 'distance' | 'yardLine' | 'personnel' | 'resultYards' | 'notes', event: Event): void {
    this.set(field, (event.target as HTMLInputElement | HTMLTextAreaElement).value);
  }

  /** Saves pending changes; resolves false when they could not be saved (the panel says why). */
  saveIfChanged(): Promise<boolean> {
    if (this.saving()) return Promise.resolve(false);
    const { update, errors } = this.pending();
    this.attempted.set(true);
    if (Object.keys(errors).length > 0) {
      this.problem.set('Fix the marked fields first.');
      return Promise.resolve(false);
    }
    if (Object.keys(update).length === 0) return Promise.resolve(true);
    const snaps = this.targets();
    const request: Observable<Snap[]> =
      snaps.length === 1
        ? this.api.tagSnap(snaps[0].id, update).pipe(map((snap) => [snap]))
        : this.api.tagSnaps(this.sessionId(), snaps.map((s) => s.id), update).pipe(map((response) => response.snaps));
    this.saving.set(true);
    this.problem.set(null);
    return firstValueFrom(request).then(
      (result) => {
        this.saving.set(false);
        this.justSaved.set(true);
        this.attempted.set(false);
        this.touched.set(new Set());
        if (snaps.length === 1) this.savedCopy.set({ replaces: snaps[0], snap: result[0] });
        this.draft.set(snaps.length === 1 ? draftFromSnap(result[0]) : BLANK_DRAFT);
        this.announcement.set(snaps.length === 1 ? `Snap ${snaps[0].order} saved` : `${snaps.length} snaps saved`);
        this.saved.emit(result);
        return true;
      },
      (failure: unknown) => {
        this.saving.set(false);
        const error = readApiError(failure);
        this.serverErrors.set(error.fields as TagErrors);
        this.problem.set(error.message);
        return false;
      },
    );
  }

  protected onKey(event: KeyboardEvent): void {
    if (this.targets().length === 0 || event.defaultPrevented) return;
    const target = event.target as HTMLElement | null;
    const inPanel = target instanceof Node && this.host.nativeElement.contains(target);
    if (event.key === 'Enter' && !event.shiftKey && !event.altKey) {
      if (this.enterSaves(target, inPanel, event.ctrlKey || event.metaKey)) {
        event.preventDefault();
        void this.saveIfChanged();
      }
      return;
    }
    if (event.key === 'Escape' && inPanel && isTypingTarget(target)) {
      this.host.nativeElement.querySelector<HTMLElement>('.panel')?.focus();
      event.preventDefault();
      return;
    }
    if (event.shiftKey || !isPageShortcut(event)) return;
    const action = TAG_KEYS[event.key.toLowerCase()];
    if (!action) return;
    event.preventDefault();
    if (action.kind === 'set') {
      this.set(action.field, action.value);
      this.announcement.set(`Down ${action.value}`);
    } else if (action.kind === 'cycle') {
      this.cycle(action.field);
    } else {
      this.host.nativeElement.querySelector<HTMLElement>(`[data-field=${action.field}]`)?.focus();
    }
  }

  private cycle<F extends keyof typeof CYCLES>(field: F): void {
    const value = nextInCycle(CYCLES[field] as readonly TagDraft[F][], this.draft()[field]) as TagDraft[F];
    this.set(field, value);
    const shown = value === null ? 'empty' : field === 'quarter' && value === 5 ? 'overtime' : String(value);
    this.announcement.set(`${CYCLE_LABELS[field]}: ${shown}`);
  }

  /** Enter saves from the page and from this panel's fields, not where Enter already means something. */
  private enterSaves(target: HTMLElement | null, inPanel: boolean, withModifier: boolean): boolean {
    if (target instanceof HTMLTextAreaElement) return inPanel && withModifier;
    if (isTypingTarget(target)) return inPanel && !target?.closest('mat-select, .cdk-overlay-container');
    return !isButtonTarget(target);
  }
}
