import { ChangeDetectionStrategy, Component, ViewEncapsulation } from '@angular/core';

/**
 * Printing the Study Report: only the table, black on white. Unscoped because the app's toolbar
 * and navigation live outside the page; every rule waits for body.tw-printing-study-report.
 */
@Component({
  selector: 'tw-study-report-print',
  changeDetection: ChangeDetectionStrategy.OnPush,
  encapsulation: ViewEncapsulation.None,
  template: '',
  styles: `
    @media print {
      body.tw-printing-study-report .mat-toolbar,
      body.tw-printing-study-report .mat-sidenav,
      body.tw-printing-study-report .skip-link,
      body.tw-printing-study-report .no-print,
      body.tw-printing-study-report .cdk-overlay-container {
        display: none !important;
      }
      body.tw-printing-study-report .mat-drawer-container,
      body.tw-printing-study-report .mat-drawer-content,
      body.tw-printing-study-report .mat-sidenav-content {
        margin: 0 !important;
        overflow: visible !important;
        background: #fff !important;
      }
      body.tw-printing-study-report .tw-page {
        max-width: none;
        padding: 0;
      }
      .study-report,
      .study-report * {
        color: #000 !important;
        background: #fff !important;
      }
      .study-report th,
      .study-report td {
        border: 1px solid #000 !important;
      }
    }
  `,
})
export class StudyReportPrint {}
