import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, input, linkedSignal, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import type { Scheme } from '@shared/api/grading';
import type { Position } from '@shared/roster';
import { CellView, cellView } from './cell-view';
import { ConflictChoice } from './conflict-choice';
import { GradeColumn, activeExtraKeys, gradeColumns } from './grade-columns';
import { GradeDraft, draftResult, rowFill, rowPlus } from './grade-draft';
import { CellEdit, applyCellEdit, markAssignment, markLoaf } from './grade-edits';
import { actionFor, keyName } from './grade-keys';
import { GradeSaveQueue, RowSaveState } from './grade-save-queue';
import { KeyMapStore } from './key-map-store';
import { QueuedGrade, gradeKey } from './queued-grade';
import { RowDetailsData, RowDetailsDialog } from './row-details-dialog';
import { SAVE_STATE_VIEW } from './save-state-labels';

/** A lineman on the field for this snap. */
export interface GridPlayer {
  playerId: number;
  name: string;
  jersey: number | null;
  position: Position;
  /** Other coaches who graded him on this snap. */
  alsoGradedBy: readonly string[];
}

export type DeskAction = 'nextSnap' | 'previousSnap' | 'compare' | 'help';

interface GridRow {
  player: GridPlayer;
  draft: GradeDraft;
  state: RowSaveState;
  cells: CellView[];
  entry: QueuedGrade | null;
}

/** Quick digits in one count cell make one number (1 then 2 → 12). */
const DIGIT_JOIN_MS = 1000;

/**
 * The grade grid of one snap: a row per lineman, a cell per part of the grade. Keyboard first
 * (the coach's key map), every change saved through the save queue.
 */
@Component({
  selector: 'tw-grade-grid',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ConflictChoice, MatButtonModule, MatIconModule],
  templateUrl: './grade-grid.html',
  styleUrl: './grade-grid.scss',
})
export class GradeGrid {
  readonly sessionId = input.required<number>();
  readonly snapId = input.required<number>();
  readonly snapOrder = input<number | null>(null);
  readonly players = input.required<readonly GridPlayer[]>();
  readonly scheme = input.required<Scheme>();
  readonly locked = input(false);
  /** Keys that belong to the desk (snap to snap, compare, help) pressed inside the grid. */
  readonly deskAction = output<DeskAction>();

  private readonly queue = inject(GradeSaveQueue);
  private readonly keys = inject(KeyMapStore);
  private readonly dialog = inject(MatDialog);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  protected readonly stateView = SAVE_STATE_VIEW;
  protected readonly columns = computed(() => gradeColumns(this.scheme()));
  private readonly extras = computed(() => activeExtraKeys(this.scheme()));

  /** A new snap starts on the first lineman, in the same column. */
  private readonly cursorState = linkedSignal<number, { row: number; col: number }>({
    source: this.snapId,
    computation: (_snap, previous) => ({ row: 0, col: previous?.value.col ?? 0 }),
  });
  protected readonly cursor = computed(() => {
    const { row, col } = this.cursorState();
    return { row: Math.max(0, Math.min(row, this.players().length - 1)), col: Math.min(col, this.columns().length - 1) };
  });
  protected readonly announcement = signal('');
  private digits: { key: string; value: number; at: number } | null = null;

  protected readonly rows = computed<GridRow[]>(() => {
    const sessionId = this.sessionId();
    const snapId = this.snapId();
    const columns = this.columns();
    const rule = this.scheme().resultRule;
    const extras = this.extras();
    const entries = this.queue.byKey();
    return this.players().map((player) => {
      const draft = this.queue.draftFor(snapId, player.playerId);
      const result = draftResult(draft, rule, extras);
      return {
        player,
        draft,
        state: this.queue.rowState(sessionId, snapId, player.playerId),
        cells: columns.map((column) => cellView(draft, column, result)),
        entry: entries.get(gradeKey(snapId, player.playerId)) ?? null,
      };
    });
  });

  protected cellId(row: number, col: number): string {
    return `grade-cell-${row}-${col}`;
  }

  /** Puts the keyboard on the current cell (after a snap change, or from the desk). */
  focus(): void {
    const { row, col } = this.cursor();
    this.host.nativeElement.querySelector<HTMLElement>(`#${this.cellId(row, col)}`)?.focus();
  }

  protected onCellFocus(row: number, col: number): void {
    const current = this.cursor();
    if (current.row !== row || current.col !== col) this.cursorState.set({ row, col });
  }

  protected onCellClick(row: number, col: number): void {
    this.moveTo(row, col);
    const column = this.columns()[col];
    if (column.kind === 'note' || column.kind === 'penalties') this.openDetails(row);
    else if (column.kind === 'assignment' || column.kind === 'mark' || column.kind === 'effort') this.editCell(row, column, { kind: 'cycle' });
  }

  protected onKey(event: KeyboardEvent): void {
    if (event.defaultPrevented || event.isComposing) return;
    if (!(event.target instanceof HTMLElement) || event.target.getAttribute('role') !== 'gridcell') return;
    const name = keyName(event);
    if (name === null) return;
    if (this.move(name) || this.handle(name)) event.preventDefault();
  }

  private move(name: string): boolean {
    const { row, col } = this.cursor();
    const lastRow = this.players().length - 1;
    const lastCol = this.columns().length - 1;
    switch (name) {
      case 'ArrowUp':
        return this.moveTo(row - 1, col);
      case 'ArrowDown':
        return this.moveTo(row + 1, col);
      case 'ArrowLeft':
        return this.moveTo(row, col - 1);
      case 'ArrowRight':
        return this.moveTo(row, col + 1);
      case 'Home':
        return this.moveTo(row, 0);
      case 'End':
        return this.moveTo(row, lastCol);
      case 'Tab':
        // At the very last cell Tab leaves the grid as usual.
        return col < lastCol ? this.moveTo(row, col + 1) : row < lastRow ? this.moveTo(row + 1, 0) : false;
      case 'Shift+Tab':
        return col > 0 ? this.moveTo(row, col - 1) : row > 0 ? this.moveTo(row - 1, lastCol) : false;
      default:
        return false;
    }
  }

  /** True when the key was used (even if only to say it changes nothing here). */
  private handle(name: string): boolean {
    const { row, col } = this.cursor();
    const column = this.columns()[col];
    const current = this.rows()[row];
    if (!current || !column) return false;

    if (name === 'Enter') {
      if (column.kind === 'note' || column.kind === 'penalties') this.openDetails(row);
      else this.editCell(row, column, { kind: 'cycle' });
      return true;
    }
    if (/^[0-9]$/.test(name)) {
      const digit = Number(name);
      if (column.kind === 'count') return this.typeCount(row, col, column, digit);
      if ((column.kind === 'assignment' || column.kind === 'penalties') && digit > 0) return this.editCell(row, column, { kind: 'pick', index: digit - 1 });
    }

    const action = actionFor(this.keys.map(), name);
    if (action === null) return false;
    switch (action) {
      case 'nextSnap':
      case 'previousSnap':
      case 'compare':
      case 'help':
        this.deskAction.emit(action);
        return true;
      case 'note':
        this.openDetails(row);
        return true;
      case 'focusGrid':
        return true;
    }
    if (this.locked()) {
      this.announcement.set('Grading of this session is locked: nothing was changed.');
      return true;
    }
    switch (action) {
      case 'plus':
      case 'minus':
      case 'clear':
        return this.editCell(row, column, { kind: action });
      case 'right':
      case 'missed':
        this.write(row, markAssignment(current.draft, action), `assignment ${action}`);
        return true;
      case 'loaf':
        this.write(row, markLoaf(current.draft), 'effort loaf');
        return true;
      case 'rowPlus':
      case 'rowFill': {
        const draft = action === 'rowPlus' ? rowPlus(current.draft, this.extras()) : rowFill(current.draft, this.extras());
        this.write(row, draft, action === 'rowPlus' ? 'whole row plus' : 'rest of the row plus');
        if (row < this.players().length - 1) this.moveTo(row + 1, col);
        else this.announcement.update((text) => `${text}. Last lineman on this snap.`);
        return true;
      }
    }
  }

  private editCell(row: number, column: GradeColumn, edit: CellEdit): boolean {
    const current = this.rows()[row];
    if (!current) return false;
    if (this.locked()) {
      this.announcement.set('Grading of this session is locked: nothing was changed.');
      return true;
    }
    const draft = applyCellEdit(current.draft, column, edit, this.scheme());
    if (draft === null) {
      this.announcement.set(`That key changes nothing in ${column.label}.`);
      return true;
    }
    this.write(row, draft, column.label);
    return true;
  }

  private typeCount(row: number, col: number, column: Extract<GradeColumn, { kind: 'count' }>, digit: number): boolean {
    const key = `${this.snapId()}:${row}:${col}`;
    const now = Date.now();
    const joined = this.digits && this.digits.key === key && now - this.digits.at < DIGIT_JOIN_MS ? this.digits.value * 10 + digit : digit;
    const value = joined > 99 ? digit : joined;
    this.digits = { key, value, at: now };
    return this.editCell(row, column, { kind: 'count', value });
  }

  private write(row: number, draft: GradeDraft, what: string): void {
    const current = this.rows()[row];
    if (!current) return;
    this.queue.edit(this.sessionId(), this.snapId(), current.player.playerId, draft);
    const result = draftResult(draft, this.scheme().resultRule, this.extras());
    const cell = this.columns().find((c) => c.label === what);
    const value = cell ? cellView(draft, cell, result).spoken : what;
    this.announcement.set(`${current.player.position} ${current.player.name}: ${value}. Result ${result ?? 'not yet'}.`);
  }

  private moveTo(row: number, col: number): boolean {
    const lastRow = this.players().length - 1;
    const lastCol = this.columns().length - 1;
    if (lastRow < 0) return false;
    const next = { row: Math.max(0, Math.min(row, lastRow)), col: Math.max(0, Math.min(col, lastCol)) };
    this.cursorState.set(next);
    this.host.nativeElement.querySelector<HTMLElement>(`#${this.cellId(next.row, next.col)}`)?.focus();
    return true;
  }

  protected openDetails(row: number): void {
    const current = this.rows()[row];
    if (!current) return;
    const scheme = this.scheme();
    const data: RowDetailsData = {
      title: `${current.player.position} · ${current.player.jersey !== null ? '#' + current.player.jersey + ' ' : ''}${current.player.name}`,
      snapOrder: this.snapOrder(),
      draft: current.draft,
      missedReasons: scheme.missedReasons,
      penaltyTypes: scheme.penaltyTypes,
      readOnly: this.locked(),
    };
    this.dialog
      .open<RowDetailsDialog, RowDetailsData, GradeDraft>(RowDetailsDialog, { data, width: '560px', maxWidth: '96vw', autoFocus: 'textarea' })
      .afterClosed()
      .subscribe((draft) => {
        if (draft && !this.locked()) this.write(row, draft, 'details');
      });
  }

  protected keepMine(row: GridRow): void {
    this.queue.keepMine(this.snapId(), row.player.playerId);
  }

  protected takeTheirs(row: GridRow): void {
    this.queue.takeTheirs(this.snapId(), row.player.playerId);
  }

  protected discard(row: GridRow): void {
    this.queue.discard(this.snapId(), row.player.playerId);
  }

  protected retry(): void {
    this.queue.retryNow();
  }
}
