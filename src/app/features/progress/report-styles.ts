import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, ViewEncapsulation, inject } from '@angular/core';

const BODY_CLASS = 'tw-printing-report';

/** Plain CSS (no Sass) so the build and the component tests see the same text. */
export const REPORT_CSS = `
  /* The numbers tables under every chart, and the word-and-symbol marks, shared by the report pages. */
  .tw-numbers {
    width: 100%;
    border-collapse: collapse;
    font: var(--mat-sys-body-small);
  }
  .tw-numbers th,
  .tw-numbers td {
    padding: 4px 8px;
    text-align: left;
    vertical-align: top;
    border-bottom: 1px solid var(--mat-sys-outline-variant);
  }
  .tw-numbers thead th {
    font-weight: 600;
    background: var(--mat-sys-surface-container-low);
  }
  .tw-numbers .num {
    text-align: right;
    font-variant-numeric: tabular-nums;
    white-space: nowrap;
  }
  .tw-report h2 {
    font: var(--mat-sys-title-large);
    margin: 24px 0 8px;
  }
  .tw-report .tw-hint {
    margin: 0 0 8px;
    font: var(--mat-sys-body-small);
    color: var(--mat-sys-on-surface-variant);
  }
  @media screen {
    .tw-report .print-only {
      display: none !important;
    }
  }
  @media print {
    @page {
      margin: 12mm;
    }
    body.${BODY_CLASS} {
      background: #fff !important;
    }
    body.${BODY_CLASS} .mat-toolbar,
    body.${BODY_CLASS} .mat-drawer,
    body.${BODY_CLASS} .mat-sidenav,
    body.${BODY_CLASS} .skip-link,
    body.${BODY_CLASS} .no-print,
    body.${BODY_CLASS} .cdk-overlay-container {
      display: none !important;
    }
    body.${BODY_CLASS} .mat-drawer-container,
    body.${BODY_CLASS} .mat-drawer-content,
    body.${BODY_CLASS} .mat-sidenav-content {
      margin: 0 !important;
      overflow: visible !important;
      background: #fff !important;
      transition: none !important;
    }
    body.${BODY_CLASS} .tw-page {
      max-width: none;
      padding: 0;
    }
    /* Black on white; words and symbols carry every meaning, so nothing is lost without colour. */
    .tw-report,
    .tw-report *:not(svg *) {
      color: #000 !important;
      box-shadow: none !important;
    }
    .tw-report .tw-card,
    .tw-report section {
      break-inside: avoid;
    }
    .tw-report .tw-card {
      border: 1px solid #000 !important;
      border-radius: 0 !important;
      background: #fff !important;
    }
    .tw-report table {
      border-collapse: collapse;
    }
    .tw-report th,
    .tw-report td {
      border: 1px solid #555 !important;
    }
    .tw-report .tw-table-scroll {
      overflow: visible !important;
      border: 0 !important;
    }
  }
`;

/**
 * The table styles and the print stylesheet of the development reports (Progress, Readiness, Position Battle, Depth Chart,
 * Calibration). Unscoped on purpose: printing must hide the toolbar and navigation, which live outside
 * the page. Every shell rule sits behind body.tw-printing-report, which `printableReport()` sets while
 * a report page is open.
 */
@Component({
  selector: 'tw-report-styles',
  changeDetection: ChangeDetectionStrategy.OnPush,
  encapsulation: ViewEncapsulation.None,
  template: '',
  styles: REPORT_CSS,
})
export class ReportStyles {}

/** Call in a page's constructor: the print rules act only while that page is open. */
export function printableReport(): void {
  const body = inject(DOCUMENT).body;
  body.classList.add(BODY_CLASS);
  inject(DestroyRef).onDestroy(() => body.classList.remove(BODY_CLASS));
}
