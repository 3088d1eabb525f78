import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

@Component({
  selector: 'tw-not-found-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, RouterLink],
  template: `
    <main id="main" class="wrap">
      <mat-icon class="icon" aria-hidden="true">wrong_location</mat-icon>
      <h1>Nothing at this address</h1>
      <p>The link may be old, or the page moved. Check the address, or start again from This Week.</p>
      <a mat-flat-button routerLink="/">Go to This Week</a>
    </main>
  `,
  styles: `
    .wrap {
      max-width: 480px;
      margin: 12vh auto 0;
      padding: 24px;
      text-align: center;
    }
    .icon {
      font-size: 48px;
      width: 48px;
      height: 48px;
      color: var(--tw-field-green);
    }
    h1 {
      font: var(--mat-sys-headline-small);
    }
    p {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class NotFoundPage {}
