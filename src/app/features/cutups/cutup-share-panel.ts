import { ChangeDetectionStrategy, Component, input, model } from '@angular/core';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import type { Player } from '@shared/api/roster';
import { POSITION_GROUPS, POSITION_GROUP_LABELS, type PositionGroup } from '@shared/film-room';

/** Who sees the cut-up in his Study Queue: whole position groups and single players. */
@Component({
  selector: 'tw-cutup-share-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatCheckboxModule, MatFormFieldModule, MatSelectModule],
  template: `
    <fieldset class="groups">
      <legend>Position groups</legend>
      @for (g of allGroups; track g) {
        <mat-checkbox [checked]="groups().includes(g)" (change)="toggle(g, $event.checked)">{{ labels[g] }}</mat-checkbox>
      }
    </fieldset>
    <mat-form-field>
      <mat-label>Players</mat-label>
      <mat-select multiple [value]="playerIds()" (valueChange)="playerIds.set($event)">
        @for (p of players(); track p.id) {
          <mat-option [value]="p.id">#{{ p.jersey }} {{ p.name }}</mat-option>
        }
      </mat-select>
      <mat-hint>{{ hint() }}</mat-hint>
    </mat-form-field>
  `,
  styles: `
    :host {
      display: flex;
      flex-direction: column;
      gap: 8px;
    }
    .groups {
      border: 0;
      margin: 0;
      padding: 0;
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(160px, 1fr));
    }
    legend {
      font: var(--mat-sys-label-large);
      margin-bottom: 2px;
    }
    mat-form-field {
      width: 100%;
    }
  `,
})
export class CutupSharePanel {
  readonly players = input<readonly Player[]>([]);
  readonly groups = model<PositionGroup[]>([]);
  readonly playerIds = model<number[]>([]);

  protected readonly allGroups = POSITION_GROUPS;
  protected readonly labels = POSITION_GROUP_LABELS;

  protected hint(): string {
    const groups = this.groups().length;
    const players = this.playerIds().length;
    if (groups === 0 && players === 0) return 'Not shared yet: only staff see it.';
    return 'Players see it in their Study Queue.';
  }

  protected toggle(group: PositionGroup, on: boolean): void {
    this.groups.update((list) => (on ? [...new Set([...list, group])] : list.filter((g) => g !== group)));
  }
}
