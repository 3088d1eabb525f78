import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { RouterLink } from '@angular/router';

/** The frame of the pages used before signing in: brand band and one centred card, phone first. */
@Component({
  selector: 'tw-account-frame',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [RouterLink],
  template: `
    <header class="band">
      <a class="brand" routerLink="/sign-in">Trenchwork</a>
    </header>
    <main id="main" class="card">
      <h1>{{ heading() }}</h1>
      <ng-content />
    </main>
  `,
  styleUrl: './account-frame.scss',
})
export class AccountFrame {
  readonly heading = input.required<string>();
}
