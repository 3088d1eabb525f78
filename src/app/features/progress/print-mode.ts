import { DOCUMENT } from '@angular/common';
import { ApplicationRef, Injectable, inject, signal } from '@angular/core';

/**
 * True while the browser prepares a printout. Charts size themselves to their box on screen; on
 * paper they switch to a fixed width that fits a portrait page. The view is refreshed synchronously
 * in `beforeprint` because zoneless change detection would otherwise run after the page is laid out.
 */
@Injectable({ providedIn: 'root' })
export class PrintMode {
  private readonly appRef = inject(ApplicationRef);
  private readonly printingNow = signal(false);
  readonly printing = this.printingNow.asReadonly();

  constructor() {
    const view = inject(DOCUMENT).defaultView;
    view?.addEventListener('beforeprint', () => this.set(true));
    view?.addEventListener('afterprint', () => this.set(false));
  }

  /** The Print buttons: lay out for paper first, then open the dialog. */
  print(): void {
    this.set(true);
    window.print();
    this.set(false);
  }

  private set(on: boolean): void {
    if (this.printingNow() === on) return;
    this.printingNow.set(on);
    this.appRef.tick();
  }
}
