import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatChipsModule } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { Observable, catchError, combineLatest, debounceTime, distinctUntilChanged, map, of, startWith, switchMap } from 'rxjs';
import type { FilmSession, TagListItem } from '@shared/api/film';
import type { Player } from '@shared/api/roster';
import { ANGLES, ANGLE_LABELS, type Angle } from '@shared/film';
import { readApiError } from '../../core/http/api-error';
import { POINT_COMPONENT_LABELS } from '../coaching-points/point-labels';
import { EMPTY_FILTER, FILTER_COMPONENTS, FilterComponent, FilterFormValue, filterFrom, narrowsEnough, sameFilter } from './cutup-filter';
import { CutupsApi, PreviewClip } from './cutups-api';
import { clipLabel } from './reel-item';

type PreviewState =
  | { kind: 'idle' }
  | { kind: 'loading' }
  | { kind: 'done'; clips: PreviewClip[] }
  | { kind: 'error'; message: string };

const PREVIEW_DELAY_MS = 300;

/**
 * Finds clips for a cut-up: sessions, concepts, fronts, one player's plus or minus on a part of
 * the grade, and the camera angle. The matching clips show as the filter changes; add them one by
 * one or all at once.
 */
@Component({
  selector: 'tw-cutup-filter-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatButtonToggleModule, MatChipsModule, MatFormFieldModule, MatIconModule, MatProgressBarModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './cutup-filter-panel.html',
  styleUrl: './cutup-filter-panel.scss',
})
export class CutupFilterPanel {
  readonly teamId = input.required<number>();
  readonly sessions = input<readonly FilmSession[]>([]);
  readonly tagItems = input<readonly TagListItem[]>([]);
  readonly players = input<readonly Player[]>([]);
  /** Clips already in the cut-up. */
  readonly chosen = input<ReadonlySet<number>>(new Set());
  readonly add = output<PreviewClip[]>();

  private readonly api = inject(CutupsApi);

  protected readonly angles = ANGLES;
  protected readonly angleLabels = ANGLE_LABELS;
  protected readonly components = FILTER_COMPONENTS;
  protected readonly componentLabels = POINT_COMPONENT_LABELS;
  protected readonly label = clipLabel;

  protected readonly form = new FormGroup({
    sessionIds: new FormControl<number[]>([], { nonNullable: true }),
    conceptIds: new FormControl<number[]>([], { nonNullable: true }),
    frontIds: new FormControl<number[]>([], { nonNullable: true }),
    playerId: new FormControl<number | null>(null),
    component: new FormControl<FilterComponent | ''>('', { nonNullable: true }),
    mark: new FormControl<'plus' | 'minus'>('minus', { nonNullable: true }),
    angle: new FormControl<Angle | ''>('', { nonNullable: true }),
  });

  protected readonly concepts = computed(() => this.tagItems().filter((t) => t.kind === 'concept' && t.active));
  protected readonly fronts = computed(() => this.tagItems().filter((t) => t.kind === 'front' && t.active));
  protected readonly hasPlayer = toSignal(this.form.controls.playerId.valueChanges.pipe(map((id) => id !== null)), { initialValue: false });

  constructor() {
    // A grade part and its mark mean something only for one player's grades.
    effect(() => {
      const on = this.hasPlayer();
      for (const control of [this.form.controls.component, this.form.controls.mark]) {
        if (on) control.enable({ emitEvent: false });
        else control.disable({ emitEvent: false });
      }
    });
  }

  private readonly filter$ = this.form.valueChanges.pipe(
    startWith(this.form.getRawValue()),
    debounceTime(PREVIEW_DELAY_MS),
    map(() => filterFrom({ ...EMPTY_FILTER, ...this.form.getRawValue() } as FilterFormValue)),
    distinctUntilChanged(sameFilter),
  );

  protected readonly preview = toSignal(
    combineLatest([toObservable(this.teamId), this.filter$]).pipe(
      switchMap(([teamId, filter]): Observable<PreviewState> => {
        if (!narrowsEnough(filter)) return of({ kind: 'idle' });
        return this.api.preview(teamId, filter).pipe(
          map((answer): PreviewState => ({ kind: 'done', clips: answer.clips })),
          catchError((failure: unknown) => of<PreviewState>({ kind: 'error', message: readApiError(failure).message })),
          startWith<PreviewState>({ kind: 'loading' }),
        );
      }),
    ),
    { initialValue: { kind: 'idle' } as PreviewState },
  );

  protected readonly found = computed(() => {
    const state = this.preview();
    return state.kind === 'done' ? state.clips : [];
  });
  protected readonly notYetChosen = computed(() => this.found().filter((c) => !this.chosen().has(c.clipId)));
  protected readonly foundText = computed(() => {
    const total = this.found().length;
    if (total === 0) return 'No clips match.';
    const already = total - this.notYetChosen().length;
    return `${total} ${total === 1 ? 'clip matches' : 'clips match'}${already > 0 ? ` (${already} already in the cut-up)` : ''}.`;
  });

  protected playerName(player: Player): string {
    return `#${player.jersey} ${player.name}`;
  }

  protected clear(): void {
    this.form.reset({ ...EMPTY_FILTER });
  }
}
