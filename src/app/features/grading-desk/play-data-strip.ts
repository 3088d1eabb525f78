import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { Snap, TagListItem } from '@shared/api/film';
import { readApiError } from '../../core/http/api-error';
import { FilmApi } from '../film-library/film-api';
import { TagDraft, TagField, changedTags, draftFromSnap } from '../film-library/tag-draft';

type ListField = 'formationId' | 'conceptId' | 'frontId' | 'outcomeId';
const LIST_KIND: Record<ListField, TagListItem['kind']> = { formationId: 'formation', conceptId: 'concept', frontId: 'front', outcomeId: 'outcome' };
const ORDINAL = ['', '1st', '2nd', '3rd', '4th'];

/** The snap's play data in one line, editable in place (PATCH /api/snaps/{id}). */
@Component({
  selector: 'tw-play-data-strip',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './play-data-strip.html',
  styleUrl: './play-data-strip.scss',
})
export class PlayDataStrip {
  readonly snap = input.required<Snap>();
  readonly tagItems = input<readonly TagListItem[]>([]);
  readonly readOnly = input(false);
  readonly saved = output<Snap>();

  private readonly api = inject(FilmApi);
  protected readonly editing = linkedSignal({ source: () => this.snap().id, computation: () => false });
  protected readonly draft = linkedSignal<Snap, TagDraft>({ source: this.snap, computation: (snap) => draftFromSnap(snap) });
  protected readonly saving = signal(false);
  protected readonly problem = linkedSignal<number, string | null>({ source: () => this.snap().id, computation: () => null });

  protected readonly options = computed(() => {
    const pick = (field: ListField) => this.tagItems().filter((i) => i.kind === LIST_KIND[field] && (i.active || i.id === this.snap()[field]));
    return { formationId: pick('formationId'), conceptId: pick('conceptId'), frontId: pick('frontId'), outcomeId: pick('outcomeId') };
  });

  /** "Q2 · 2nd & 7 · own 35 · left hash · 11 · doubles · inside zone right · vs over · +4 · run". */
  protected readonly summary = computed(() => {
    const s = this.snap();
    const name = (id: number | null) => (id === null ? null : (this.tagItems().find((i) => i.id === id)?.name ?? null));
    const parts = [
      s.quarter !== null ? (s.quarter === 5 ? 'OT' : `Q${s.quarter}`) : null,
      s.down !== null ? `${ORDINAL[s.down]}${s.distance !== null ? ' & ' + s.distance : ''}` : null,
      s.yardLine !== null ? `${s.fieldSide ?? ''} ${s.yardLine}`.trim() : null,
      s.hash ? `${s.hash} hash` : null,
      s.personnel ? `${s.personnel} personnel` : null,
      name(s.formationId),
      [name(s.conceptId), s.direction].filter(Boolean).join(' ') || null,
      name(s.frontId) ? `vs ${name(s.frontId)}` : null,
      s.resultYards !== null ? `${s.resultYards > 0 ? '+' : s.resultYards < 0 ? '−' : ''}${Math.abs(s.resultYards)} yd` : null,
      name(s.outcomeId),
    ];
    return parts.filter((p): p is string => !!p);
  });

  protected set(field: TagField, raw: string): void {
    const numeric = ['quarter', 'down', 'formationId', 'conceptId', 'frontId', 'outcomeId'].includes(field);
    const text = ['distance', 'yardLine', 'personnel', 'resultYards', 'notes'].includes(field);
    const value = text ? raw : raw === '' ? null : numeric ? Number(raw) : raw;
    this.draft.update((d) => ({ ...d, [field]: value }));
  }

  protected value(event: Event): string {
    return (event.target as HTMLInputElement | HTMLSelectElement).value;
  }

  protected save(): void {
    const { update, errors } = changedTags(this.draft(), draftFromSnap(this.snap()), new Set());
    const firstError = Object.values(errors)[0];
    if (firstError) {
      this.problem.set(firstError);
      return;
    }
    if (Object.keys(update).length === 0) {
      this.editing.set(false);
      return;
    }
    this.saving.set(true);
    this.api.tagSnap(this.snap().id, update).subscribe({
      next: (snap) => {
        this.saving.set(false);
        this.editing.set(false);
        this.problem.set(null);
        this.saved.emit(snap);
      },
      error: (failure: unknown) => {
        this.saving.set(false);
        const error = readApiError(failure);
        this.problem.set(Object.values(error.fields)[0] ?? error.message);
      },
    });
  }

  protected onKey(event: KeyboardEvent): void {
    // Keys typed here are for the fields, never the grid or the video.
    event.stopPropagation();
    if (event.key === 'Enter' && !(event.target instanceof HTMLTextAreaElement)) {
      event.preventDefault();
      this.save();
    } else if (event.key === 'Escape') {
      this.draft.set(draftFromSnap(this.snap()));
      this.editing.set(false);
    }
  }
}
