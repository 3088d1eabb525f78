import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, numberAttribute } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { PlayerGradeSheet } from '@shared/api/player-grades';
import { AuthStore } from '../../core/auth/auth-store';
import { SafetyNote } from '../../core/feedback/safety-note';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { PlayerSheetCard } from '../grade-sheet/player-sheet-card';
import { myGradeSheetUrl } from './study-api';

/**
 * A player's own Grade Sheet of one session, read only: his row and nothing of anyone else's. The
 * mailed sheet links here. When his staff does not share grades, the API's refusal is what he reads.
 */
@Component({
  selector: 'tw-my-grade-sheet-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, MatIconModule, PlayerSheetCard, RouterLink, SafetyNote, StatePanel],
  templateUrl: './my-grade-sheet-page.html',
  styleUrl: './my-grade-sheet-page.scss',
})
export class MyGradeSheetPage {
  readonly sessionId = input.required({ transform: numberAttribute });
  private readonly auth = inject(AuthStore);

  protected readonly sheet = httpResource<PlayerGradeSheet>(() => {
    const playerId = this.auth.membership()?.playerId;
    return playerId === undefined ? undefined : { url: myGradeSheetUrl(this.sessionId(), playerId), context: inlineErrors() };
  });
  protected readonly extraLabels = computed(() => new Map(Object.entries(this.sheet.hasValue() ? this.sheet.value().extraLabels : {})));
}
