import { DOCUMENT } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, input, numberAttribute, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { POSITION_GROUPS, POSITION_GROUP_LABELS, type PositionGroup } from '@shared/film-room';
import { StatePanel } from '../../core/feedback/state-panel';
import { inlineErrors } from '../../core/http/inline-errors';
import { ReportSortKey, SortDirection, StudyReport, StudyReportRow, behind, ofWords, sortReport } from './study-report-rows';
import { StudyReportPrint } from './study-report-print';

const COLUMNS: { key: ReportSortKey; label: string }[] = [
  { key: 'player', label: 'Player' },
  { key: 'clips', label: 'Clips' },
  { key: 'watched', label: 'Watched' },
  { key: 'points', label: 'Points' },
  { key: 'acknowledged', label: 'Got it' },
];

/** Before the meeting: who of a position group watched his clips of a session and got his points. */
@Component({
  selector: 'tw-study-report-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, RouterLink, StatePanel, StudyReportPrint],
  templateUrl: './study-report-page.html',
  styleUrl: './study-report-page.scss',
})
export class StudyReportPage {
  readonly sessionId = input.required({ transform: numberAttribute });

  protected readonly groups = POSITION_GROUPS;
  protected readonly groupLabels = POSITION_GROUP_LABELS;
  protected readonly columns = COLUMNS;
  protected readonly ofWords = ofWords;
  protected readonly behind = behind;

  protected readonly group = signal<PositionGroup>('OL');
  protected readonly sortKey = signal<ReportSortKey>('player');
  protected readonly direction = signal<SortDirection>('asc');

  protected readonly report = httpResource<StudyReport>(() => ({
    url: `/api/film-sessions/${this.sessionId()}/study-report`,
    params: { group: this.group() },
    context: inlineErrors(),
  }));

  protected readonly rows = computed(() => (this.report.hasValue() ? sortReport(this.report.value().players, this.sortKey(), this.direction()) : []));
  protected readonly summary = computed(() => {
    const rows = this.rows();
    const ready = rows.filter((r) => !behind(r)).length;
    return `${ready} of ${rows.length} ${rows.length === 1 ? 'player has' : 'players have'} watched every clip and got every point.`;
  });

  constructor() {
    const body = inject(DOCUMENT).body;
    body.classList.add('tw-printing-study-report');
    inject(DestroyRef).onDestroy(() => body.classList.remove('tw-printing-study-report'));
  }

  protected sortBy(key: ReportSortKey): void {
    if (this.sortKey() === key) {
      this.direction.update((d) => (d === 'asc' ? 'desc' : 'asc'));
    } else {
      this.sortKey.set(key);
      // Numbers first from the lowest share: who is behind comes to the top.
      this.direction.set('asc');
    }
  }

  protected ariaSort(key: ReportSortKey): 'ascending' | 'descending' | 'none' {
    if (this.sortKey() !== key) return 'none';
    return this.direction() === 'asc' ? 'ascending' : 'descending';
  }

  protected playerLabel(row: StudyReportRow): string {
    return row.jersey !== null ? `#${row.jersey} ${row.name}` : row.name;
  }

  protected print(): void {
    window.print();
  }
}
