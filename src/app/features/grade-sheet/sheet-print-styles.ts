import { ChangeDetectionStrategy, Component, ViewEncapsulation } from '@angular/core';

/** Plain CSS (no Sass) so it is the same text in the build and in the component tests. */
export const SHEET_PRINT_CSS = `
    @media print {
      @page {
        margin: 12mm;
      }
      body.tw-printing-sheet {
        background: #fff !important;
      }
      body.tw-printing-sheet .mat-toolbar,
      body.tw-printing-sheet .mat-drawer,
      body.tw-printing-sheet .mat-sidenav,
      body.tw-printing-sheet .skip-link,
      body.tw-printing-sheet .no-print,
      body.tw-printing-sheet .cdk-overlay-container {
        display: none !important;
      }
      body.tw-printing-sheet .mat-drawer-container,
      body.tw-printing-sheet .mat-drawer-content,
      body.tw-printing-sheet .mat-sidenav-content {
        margin: 0 !important;
        overflow: visible !important;
        background: #fff !important;
        transition: none !important;
      }
      body.tw-printing-sheet .tw-page {
        max-width: none;
        padding: 0;
      }
      /* Black on white: on paper, symbols and words carry the meaning. */
      .grade-sheet,
      .grade-sheet * {
        color: #000 !important;
        background: #fff !important;
        box-shadow: none !important;
      }
      .grade-sheet .sheet-card {
        border: 1px solid #000 !important;
        border-radius: 0 !important;
        break-inside: avoid;
        margin-bottom: 6mm;
      }
      .grade-sheet table {
        border-collapse: collapse;
      }
      .grade-sheet th,
      .grade-sheet td {
        border: 1px solid #000 !important;
      }
      .grade-sheet .winning {
        border: 2px solid #000 !important;
      }
      .grade-sheet.page-per-player tw-player-sheet-card {
        break-after: page;
      }
    }
`;

/**
 * The Grade Sheet's print stylesheet. Unscoped on purpose: printing must also hide the app's
 * toolbar and navigation, which live outside the page. Every rule sits behind body.tw-printing-sheet,
 * which the sheet page sets only while it is open. Plain CSS, so the component tests see it too.
 */
@Component({
  selector: 'tw-sheet-print-styles',
  changeDetection: ChangeDetectionStrategy.OnPush,
  encapsulation: ViewEncapsulation.None,
  template: '',
  styles: SHEET_PRINT_CSS,
})
export class SheetPrintStyles {}
