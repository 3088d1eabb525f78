import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { ShortcutGroup } from './shortcut-keys';

/** A compact list of keyboard shortcuts: the on-screen legend and the body of the help dialog. */
@Component({
  selector: 'tw-shortcut-list',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @for (group of groups(); track group.title) {
      <section [attr.aria-label]="group.title + ' keys'">
        @if (showTitles()) {
          <h3>{{ group.title }}</h3>
        }
        <dl>
          @for (shortcut of group.shortcuts; track shortcut.action) {
            <div class="row">
              <dt>
                @for (key of shortcut.keys; track key; let last = $last) {
                  <kbd>{{ key }}</kbd>
                  @if (!last) {
                    <span class="or">/</span>
                  }
                }
              </dt>
              <dd>{{ shortcut.action }}</dd>
            </div>
          }
        </dl>
      </section>
    }
  `,
  styles: `
    :host {
      display: block;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    h3 {
      font: var(--mat-sys-title-small);
      color: var(--mat-sys-on-surface);
      margin: 8px 0 4px;
    }
    dl {
      margin: 0;
      display: grid;
      gap: 2px 16px;
      grid-template-columns: repeat(auto-fill, minmax(220px, 1fr));
    }
    .row {
      display: flex;
      gap: 8px;
      align-items: baseline;
    }
    dt {
      flex: none;
      min-width: 72px;
    }
    dd {
      margin: 0;
    }
    kbd {
      display: inline-block;
      min-width: 1.4em;
      padding: 0 4px;
      border: 1px solid var(--mat-sys-outline);
      border-bottom-width: 2px;
      border-radius: 4px;
      background: var(--mat-sys-surface-container-lowest);
      color: var(--tw-slate-ink);
      font: 600 12px/18px 'Open Sans', system-ui, sans-serif;
      text-align: center;
    }
    .or {
      margin: 0 2px;
    }
  `,
})
export class ShortcutList {
  readonly groups = input.required<readonly ShortcutGroup[]>();
  readonly showTitles = input(true);
}
