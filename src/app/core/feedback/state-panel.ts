import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import type { Resource } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { readApiError } from '../http/api-error';

type View = 'loading' | 'error' | 'empty' | 'none';

/**
 * The one loading / error / empty pattern of the app. Place it above the content and render the
 * content under `@if (resource.hasValue())`; the panel shows nothing once there is something to show.
 */
@Component({
  selector: 'tw-state-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatProgressSpinnerModule],
  template: `
    @switch (view()) {
      @case ('loading') {
        <div class="panel" role="status">
          <mat-spinner diameter="32" aria-hidden="true" />
          <span>{{ loadingLabel() }}</span>
        </div>
      }
      @case ('error') {
        <div class="tw-alert tw-alert-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>
          <div>
            <p>{{ errorMessage() }}</p>
            <button mat-button type="button" (click)="retry.emit()">Try again</button>
          </div>
        </div>
      }
      @case ('empty') {
        <div class="panel empty" role="status">
          <mat-icon aria-hidden="true">inbox</mat-icon>
          <span>{{ emptyMessage() }}</span>
        </div>
      }
    }
  `,
  styles: `
    .panel {
      display: flex;
      align-items: center;
      gap: 12px;
      padding: 24px 16px;
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-large);
    }
    .empty {
      justify-content: center;
      border: 1px dashed var(--mat-sys-outline-variant);
      border-radius: 12px;
    }
  `,
})
export class StatePanel {
  readonly resource = input.required<Resource<unknown>>();
  /** True when the loaded value has nothing to list. */
  readonly empty = input(false);
  readonly emptyMessage = input('Nothing here yet.');
  readonly loadingLabel = input('Loading…');
  readonly retry = output<void>();

  protected readonly view = computed<View>(() => {
    const resource = this.resource();
    if (resource.status() === 'error') return 'error';
    if (resource.isLoading() && !resource.hasValue()) return 'loading';
    if (resource.hasValue() && this.empty()) return 'empty';
    return 'none';
  });

  protected readonly errorMessage = computed(() => readApiError(this.resource().error()).message);
}
