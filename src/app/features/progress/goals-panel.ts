import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { SafetyNote } from '../../core/feedback/safety-note';
import { fieldError } from '../../core/forms/field-errors';
import { readApiError } from '../../core/http/api-error';
import { COMPONENT_NAMES, type Goal, type GoalComponent, type RateShape } from './development-types';
import { goalProgress } from './goal-progress';
import { ProgressApi } from './progress-api';
import { formatRate, shortDate } from './rate-text';

const GOAL_COMPONENTS: GoalComponent[] = ['overall', 'assignment', 'footwork', 'hands', 'padLevel', 'effort'];

/** A player's goals with how far each is; coaches add goals and mark them achieved. */
@Component({
  selector: 'tw-goals-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule, SafetyNote],
  templateUrl: './goals-panel.html',
  styleUrl: './goals-panel.scss',
})
export class GoalsPanel {
  readonly playerId = input.required<number>();
  readonly goals = input.required<readonly Goal[]>();
  /** Current season rates by goal component, for the snaps behind "now". */
  readonly rates = input.required<Record<GoalComponent, RateShape>>();
  readonly canEdit = input(false);
  /** After a write: the page reloads so "current" comes from the server. */
  readonly changed = output<void>();

  private readonly api = inject(ProgressApi);
  protected readonly names = COMPONENT_NAMES;
  protected readonly components = GOAL_COMPONENTS;
  protected readonly rate = formatRate;
  protected readonly date = shortDate;
  protected readonly message = fieldError;
  protected readonly adding = signal(false);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected readonly rows = computed(() => this.goals().map((goal) => ({ goal, progress: goalProgress(goal, this.rates()[goal.component]) })));

  protected readonly form = new FormGroup({
    component: new FormControl<GoalComponent>('overall', { nonNullable: true }),
    target: new FormControl<number | null>(80, { validators: [Validators.required, Validators.min(1), Validators.max(100)] }),
    dueOn: new FormControl('', { nonNullable: true }),
    note: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(500)] }),
  });

  protected add(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    this.busy.set(true);
    this.problem.set(null);
    this.api
      .addGoal(this.playerId(), {
        component: v.component,
        target: Number(v.target) / 100,
        ...(v.dueOn ? { dueOn: v.dueOn } : {}),
        ...(v.note.trim() ? { note: v.note.trim() } : {}),
      })
      .subscribe({
        next: () => {
          this.busy.set(false);
          this.adding.set(false);
          this.form.reset();
          this.changed.emit();
        },
        error: (failure: unknown) => this.fail(failure),
      });
  }

  protected setAchieved(goal: Goal, achieved: boolean): void {
    this.busy.set(true);
    this.problem.set(null);
    this.api.setAchieved(this.playerId(), goal.id, achieved).subscribe({
      next: () => {
        this.busy.set(false);
        this.changed.emit();
      },
      error: (failure: unknown) => this.fail(failure),
    });
  }

  private fail(failure: unknown): void {
    this.busy.set(false);
    const error = readApiError(failure);
    this.problem.set(Object.values(error.fields)[0] ?? error.message);
  }
}
