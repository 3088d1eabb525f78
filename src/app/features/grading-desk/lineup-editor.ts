import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { Desk } from '@shared/api/grading';
import { POSITIONS, type Position } from '@shared/roster';
import type { Participant } from './grading-api';
import type { GridPlayer } from './grade-grid';

type RosterPlayer = Desk['players'][number];

/** Who was on the field for this snap: substitutions, heavy sets, a changed spot. */
@Component({
  selector: 'tw-lineup-editor',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule],
  template: `
    <section aria-labelledby="lineup-title">
      <h2 id="lineup-title">On the field</h2>
      <p class="source">
        {{ fromDepthChart() ? 'From the depth chart; change it here for a substitution or a heavy set.' : 'Set for this snap.' }}
        @if (saving()) {
          <span role="status">Saving…</span>
        }
      </p>
      <ul>
        @for (p of players(); track p.playerId) {
          <li>
            <label>
              <span class="tw-visually-hidden">Position of {{ p.name }}</span>
              <select [disabled]="readOnly() || saving()" (change)="move(p.playerId, $any($event.target).value)">
                @for (pos of positions; track pos) {
                  <option [value]="pos" [selected]="pos === p.position">{{ pos }}</option>
                }
              </select>
            </label>
            <span class="name">{{ p.jersey !== null ? '#' + p.jersey + ' ' : '' }}{{ p.name }}</span>
            <button mat-icon-button type="button" [disabled]="readOnly() || saving()" [attr.aria-label]="'Take ' + p.name + ' off the field for this snap'" (click)="remove(p.playerId)">
              <mat-icon aria-hidden="true">person_remove</mat-icon>
            </button>
          </li>
        }
      </ul>
      @if (!readOnly()) {
        <div class="add">
          <label>
            Add
            <select [value]="addId()" (change)="addId.set($any($event.target).value)" [disabled]="saving()">
              <option value="">Choose a player…</option>
              @for (p of bench(); track p.playerId) {
                <option [value]="p.playerId">{{ p.jersey !== null ? '#' + p.jersey + ' ' : '' }}{{ p.name }} ({{ p.positions.join(', ') || '—' }})</option>
              }
            </select>
          </label>
          <label>
            at
            <select [value]="addPosition()" (change)="addPosition.set($any($event.target).value)" [disabled]="saving()">
              @for (pos of positions; track pos) {
                <option [value]="pos">{{ pos }}</option>
              }
            </select>
          </label>
          <button mat-stroked-button type="button" [disabled]="!addId() || saving()" (click)="add()">Add to this snap</button>
        </div>
      }
    </section>
  `,
  styles: `
    :host {
      display: block;
      font: var(--mat-sys-body-small);
    }
    h2 {
      font: var(--mat-sys-title-small);
      margin: 0;
    }
    .source {
      margin: 2px 0 4px;
      color: var(--mat-sys-on-surface-variant);
    }
    ul {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    li,
    .add {
      display: flex;
      align-items: center;
      gap: 6px;
    }
    .name {
      flex: 1;
    }
    .add {
      flex-wrap: wrap;
      margin-top: 4px;
    }
    select {
      font: inherit;
      padding: 2px;
    }
  `,
})
export class LineupEditor {
  readonly players = input.required<readonly GridPlayer[]>();
  readonly roster = input.required<readonly RosterPlayer[]>();
  readonly fromDepthChart = input(false);
  readonly readOnly = input(false);
  readonly saving = input(false);
  readonly changed = output<Participant[]>();

  protected readonly positions = POSITIONS;
  protected readonly addId = signal('');
  protected readonly addPosition = signal<Position>('TE');

  protected readonly bench = computed(() => {
    const on = new Set(this.players().map((p) => p.playerId));
    return this.roster().filter((p) => !on.has(p.playerId));
  });

  private current(): Participant[] {
    return this.players().map((p) => ({ playerId: p.playerId, position: p.position }));
  }

  protected move(playerId: number, position: Position): void {
    this.changed.emit(this.current().map((p) => (p.playerId === playerId ? { ...p, position } : p)));
  }

  protected remove(playerId: number): void {
    this.changed.emit(this.current().filter((p) => p.playerId !== playerId));
  }

  protected add(): void {
    const playerId = Number(this.addId());
    if (!playerId) return;
    this.changed.emit([...this.current(), { playerId, position: this.addPosition() }]);
    this.addId.set('');
  }
}
