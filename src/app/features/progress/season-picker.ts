import { ChangeDetectionStrategy, Component, inject, model } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { TeamStore } from '../../core/team/team-store';

/** The season a report covers; hidden while the team has only one. */
@Component({
  selector: 'tw-season-picker',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatFormFieldModule, MatSelectModule],
  template: `
    @if (teams.seasons().length > 1) {
      <mat-form-field class="season no-print" subscriptSizing="fixed">
        <mat-label>Season</mat-label>
        <mat-select [value]="seasonId()" (valueChange)="seasonId.set($event)">
          @for (season of teams.seasons(); track season.id) {
            <mat-option [value]="season.id">{{ season.name }}{{ season.isCurrent ? ' (current)' : '' }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
    }
  `,
  styles: `
    .season {
      width: 200px;
    }
  `,
})
export class SeasonPicker {
  protected readonly teams = inject(TeamStore);
  readonly seasonId = model<number | null>(null);
}
