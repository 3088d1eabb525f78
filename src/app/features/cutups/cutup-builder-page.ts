import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { Observable, of, switchMap } from 'rxjs';
import type { FilmSession, TagListItem } from '@shared/api/film';
import type { PlayerListResponse } from '@shared/api/roster';
import type { PositionGroup } from '@shared/film-room';
import { AuthStore } from '../../core/auth/auth-store';
import { Notifier } from '../../core/feedback/notifier';
import { SafetyNote } from '../../core/feedback/safety-note';
import { StatePanel } from '../../core/feedback/state-panel';
import { applyServerErrors, fieldError } from '../../core/forms/field-errors';
import { readApiError } from '../../core/http/api-error';
import { inlineErrors } from '../../core/http/inline-errors';
import { CutupFilterPanel } from './cutup-filter-panel';
import { CutupReel } from './cutup-reel';
import { CutupSharePanel } from './cutup-share-panel';
import { Cutup, CutupsApi, PreviewClip } from './cutups-api';
import { ReelItem, appendClips } from './reel-item';

/** The route id: a number for an existing cut-up, nothing for a new one. */
function optionalId(value: unknown): number | undefined {
  const id = Number(value);
  return Number.isInteger(id) && id > 0 ? id : undefined;
}

/**
 * Builds or edits a cut-up: find clips with the filter (or pick them one by one), put them in
 * order with a note each, name it, and share it with players and position groups.
 */
@Component({
  selector: 'tw-cutup-builder-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [CutupFilterPanel, CutupReel, CutupSharePanel, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule, RouterLink, SafetyNote, StatePanel],
  templateUrl: './cutup-builder-page.html',
  styleUrl: './cutup-builder-page.scss',
})
export class CutupBuilderPage {
  readonly cutupId = input(undefined, { transform: optionalId });

  private readonly auth = inject(AuthStore);
  private readonly api = inject(CutupsApi);
  private readonly router = inject(Router);
  private readonly notifier = inject(Notifier);

  protected readonly teamId = this.auth.teamId;
  protected readonly message = fieldError;

  protected readonly existing = httpResource<Cutup>(() => {
    const id = this.cutupId();
    return id === undefined ? undefined : { url: this.api.cutupUrl(id), context: inlineErrors() };
  });
  protected readonly sessionList = httpResource<{ sessions: FilmSession[] }>(() => {
    const teamId = this.teamId();
    return teamId === null ? undefined : { url: '/api/film-sessions', params: { teamId }, context: inlineErrors() };
  });
  protected readonly tagLists = httpResource<{ items: TagListItem[] }>(() => {
    const teamId = this.teamId();
    return teamId === null ? undefined : { url: `/api/teams/${teamId}/tag-lists`, context: inlineErrors() };
  });
  protected readonly roster = httpResource<PlayerListResponse>(() => {
    const teamId = this.teamId();
    return teamId === null ? undefined : { url: `/api/teams/${teamId}/players`, context: inlineErrors() };
  });

  protected readonly sessions = computed(() => {
    const list = this.sessionList.hasValue() ? [...this.sessionList.value().sessions] : [];
    return list.sort((a, b) => (a.date < b.date ? 1 : a.date > b.date ? -1 : b.id - a.id));
  });
  protected readonly tagItems = computed(() => (this.tagLists.hasValue() ? this.tagLists.value().items : []));
  protected readonly players = computed(() => (this.roster.hasValue() ? this.roster.value().players.filter((p) => p.status !== 'inactive') : []));

  protected readonly details = new FormGroup({
    title: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    description: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(1000)] }),
  });
  protected readonly items = signal<ReelItem[]>([]);
  protected readonly chosen = computed(() => new Set(this.items().map((i) => i.clipId)));
  protected readonly groups = signal<PositionGroup[]>([]);
  protected readonly playerIds = signal<number[]>([]);
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);

  constructor() {
    // Fill the form once from the stored cut-up; later reloads must not wipe what the coach changed.
    let filledFor: number | null = null;
    effect(() => {
      if (!this.existing.hasValue()) return;
      const cutup = this.existing.value();
      if (filledFor === cutup.id) return;
      filledFor = cutup.id;
      untracked(() => {
        this.details.reset({ title: cutup.title, description: cutup.description ?? '' });
        this.items.set(cutup.items.map((i) => ({ clipId: i.clipId, note: i.note ?? '', sessionTitle: i.sessionTitle, snapOrder: i.snapOrder, angle: i.angle, posterUrl: i.posterUrl })));
        this.groups.set([...cutup.sharedWith.groups]);
        this.playerIds.set([...cutup.sharedWith.playerIds]);
      });
    });
  }

  protected addClips(clips: PreviewClip[]): void {
    this.items.update((list) => appendClips(list, clips));
  }

  protected save(): void {
    this.problem.set(null);
    const teamId = this.teamId();
    if (this.details.invalid) {
      this.details.markAllAsTouched();
      return;
    }
    if (this.items().length === 0) {
      this.problem.set('Add at least one clip.');
      return;
    }
    if (teamId === null) return;
    const { title, description } = this.details.getRawValue();
    const items = this.items().map((i) => ({ clipId: i.clipId, note: i.note.trim() || null }));
    const share = { playerIds: this.playerIds(), groups: this.groups() };
    const id = this.cutupId();

    let saved: Observable<Cutup>;
    if (id === undefined) {
      const hasNotes = items.some((i) => i.note !== null);
      saved = this.api.create({ teamId, title: title.trim(), ...(description.trim() ? { description: description.trim() } : {}), clipIds: items.map((i) => i.clipId) }).pipe(
        // Creating takes clips only; notes go on in a second step.
        switchMap((created) => (hasNotes ? this.api.update(created.id, { items }) : of(created))),
        switchMap((created) => (share.playerIds.length || share.groups.length ? this.api.share(created.id, share) : of(created))),
      );
    } else {
      saved = this.api.update(id, { title: title.trim(), description: description.trim() || null, items }).pipe(switchMap(() => this.api.share(id, share)));
    }

    this.saving.set(true);
    saved.subscribe({
      next: (cutup) => {
        this.saving.set(false);
        this.notifier.info(`Saved “${cutup.title}”.`);
        if (id === undefined) void this.router.navigate(['/cutups', cutup.id], { replaceUrl: true });
      },
      error: (failure: unknown) => {
        this.saving.set(false);
        const error = readApiError(failure);
        const unplaced = error.status === 422 ? applyServerErrors(this.details, error.fields) : [];
        this.problem.set(unplaced[0] ?? (error.status === 422 && Object.keys(error.fields).length ? null : error.message));
      },
    });
  }
}
