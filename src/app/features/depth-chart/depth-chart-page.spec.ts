import { CdkDropList, type CdkDragDrop } from '@angular/cdk/drag-drop';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { By } from '@angular/platform-browser';
import { provideRouter } from '@angular/router';
import type { DepthChart } from '@shared/api/grading';
import type { Player } from '@shared/api/roster';
import type { Position } from '@shared/roster';
import type { Role } from '@shared/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { TEAM } from '../progress/development-test-data';
import { DepthChartPage } from './depth-chart-page';

const entry = (playerId: number, name: string, jersey: number) => ({ playerId, name, jersey });
// The current chart: saved for week 4 (the base chart is week 0); the season's last game was week 5.
const CHART: DepthChart = {
  seasonId: 5,
  updatedAt: '2026-09-01T10:00:00.000Z',
  week: 4,
  inForceFromWeek: 4,
  savedWeeks: [0, 4],
  lastGameWeek: 5,
  positions: {
    LT: [entry(11, 'Tomas Varga', 74)],
    LG: [entry(12, 'Rowan Pike', 66), entry(22, 'Abe Lund', 63)],
    C: [entry(13, 'Eli Brandt', 55)],
    RG: [entry(14, 'Odell Fry', 61)],
    RT: [entry(15, 'Marek Stoll', 78)],
    TE: [],
  },
};
const player = (id: number, name: string, jersey: number, positions: Player['positions']): Player => ({
  id, name, jersey, positions, classYear: 'Jr', redshirt: false, heightIn: null, weightLb: null, status: 'active', seasonId: 5, accountEmail: null,
});
const ROSTER = [player(11, 'Tomas Varga', 74, ['LT']), player(12, 'Rowan Pike', 66, ['LG']), player(22, 'Abe Lund', 63, ['LG', 'RG']), player(16, 'Jonah Reyes', 88, ['TE'])];
const HISTORY = {
  changes: [
    {
      id: 4,
      week: 4,
      by: 'Dana Keel',
      at: '2026-09-01T10:00:00.000Z',
      reason: 'Pike back from injury',
      before: [{ position: 'LG', rank: 1, playerId: 22 }, { position: 'LG', rank: 2, playerId: 12 }],
      after: [{ position: 'LG', rank: 1, playerId: 12 }, { position: 'LG', rank: 2, playerId: 22 }],
    },
  ],
};

describe('DepthChartPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<DepthChartPage>;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const answer = async (url: string, body: object) => (await waitFor(() => (TestBed.tick(), http.match((r) => r.url === url)[0]), url)).flush(body);
  const column = (pos: Position) => element().querySelector(`ol[data-position="${pos}"]`) as HTMLElement;
  const names = (pos: Position) => Array.from(column(pos).querySelectorAll('.who a'), (a) => a.textContent?.trim());

  async function render(role: Role) {
    TestBed.inject(AuthStore).setSession(sessionFor(role));
    fixture = TestBed.createComponent(DepthChartPage);
    await answer('/api/teams/1', TEAM);
    await answer('/api/teams/1/depth-chart', CHART);
    await answer('/api/teams/1/players', { players: ROSTER, seasonId: 5 });
    await answer('/api/teams/1/depth-chart/history', HISTORY);
    await fixture.whenStable();
  }

  /** What CDK emits when a card is dropped: the lists' data are the positions. */
  function drop(from: Position, previousIndex: number, to: Position, currentIndex: number) {
    const lists = fixture.debugElement.queryAll(By.directive(CdkDropList)).map((d) => d.injector.get(CdkDropList<Position>));
    const source = lists.find((l) => l.data === from)!;
    const target = lists.find((l) => l.data === to)!;
    target.dropped.emit({ previousIndex, currentIndex, previousContainer: source, container: target, isPointerOverContainer: true } as unknown as CdkDragDrop<Position>);
  }

  it('sends the new order of the dragged position, with the reason, in the PUT body', async () => {
    await render('coordinator');
    expect(names('LG')).toEqual(['#66 Rowan Pike', '#63 Abe Lund']);
    drop('LG', 1, 'LG', 0);
    await fixture.whenStable();
    expect(names('LG')).toEqual(['#63 Abe Lund', '#66 Rowan Pike']);
    expect(element().textContent).toContain('Not saved yet: LG');

    const save = Array.from(element().querySelectorAll('button')).find((b) => b.textContent?.includes('Save the depth chart')) as HTMLButtonElement;
    save.click();
    await fixture.whenStable();
    expect(element().textContent).toContain('Say why the chart changes');
    http.expectNone((r) => r.method === 'PUT');

    const reason = element().querySelector('input[name=reason]') as HTMLInputElement;
    reason.value = 'Lund won the week of practice';
    reason.dispatchEvent(new Event('input'));
    save.click();
    const put = http.expectOne((r) => r.method === 'PUT' && r.url === '/api/teams/1/depth-chart');
    expect(put.request.body).toEqual({ seasonId: 5, week: 4, positions: { LG: [22, 12] }, reason: 'Lund won the week of practice' });
    put.flush({ ...CHART, positions: { ...CHART.positions, LG: [CHART.positions['LG'][1], CHART.positions['LG'][0]] } });
    await answer('/api/teams/1/depth-chart/history', HISTORY);
    await fixture.whenStable();
    expect(element().textContent).not.toContain('Not saved yet');
    expect(names('LG')).toEqual(['#63 Abe Lund', '#66 Rowan Pike']);
  });

  it('copies a swing player to a second position when the copy mode is on', async () => {
    await render('admin');
    (Array.from(element().querySelectorAll('mat-button-toggle button')).find((b) => b.textContent?.includes('Lists him at both')) as HTMLButtonElement).click();
    await fixture.whenStable();
    drop('LG', 1, 'RG', 1);
    await fixture.whenStable();
    expect(names('RG')).toEqual(['#61 Odell Fry', '#63 Abe Lund']);
    expect(names('LG')).toEqual(['#66 Rowan Pike', '#63 Abe Lund']);
    expect(element().textContent).toContain('Not saved yet: RG');
    expect(column('LG').textContent).toContain('also at RG');
    expect(column('RG').textContent).toContain('also at LG');
  });

  it('is read-only for a position coach, with the history of who changed what and why', async () => {
    await render('coach');
    expect(element().textContent).toContain('Read only');
    expect(element().querySelector('.handle')).toBeNull();
    expect(element().querySelector('select.add')).toBeNull();
    drop('LG', 1, 'LG', 0);
    await fixture.whenStable();
    expect(names('LG')).toEqual(['#66 Rowan Pike', '#63 Abe Lund']);
    const history = element().querySelector('[data-testid=history]')?.textContent ?? '';
    expect(history).toContain('Dana Keel');
    expect(history).toContain('“Pike back from injury”');
    expect(history).toContain('LG: Rowan Pike, Abe Lund (was Abe Lund, Rowan Pike)');
    expect(history).toContain('for Week 4');
  });

  describe('week picker', () => {
    const picker = () => element().querySelector('select[name=week]') as HTMLSelectElement;
    const status = () => element().querySelector('[data-testid=week-status] span')?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
    /** Picks a week and answers the GET that asks for it. */
    async function pickWeek(week: number, chart: DepthChart) {
      picker().value = String(week);
      picker().dispatchEvent(new Event('change'));
      const request = await waitFor(() => (TestBed.tick(), http.match((r) => r.url === '/api/teams/1/depth-chart' && r.params.get('week') === String(week))[0]), `week ${week}`);
      expect(request.request.params.get('seasonId')).toBe('5');
      request.flush(chart);
      await fixture.whenStable();
    }

    it('offers week 0 (base) to the week after the last game, marks saved weeks in words, and opens on the current week', async () => {
      await render('coach');
      const options = Array.from(picker().options, (o) => o.textContent?.trim());
      // lastGameWeek 5 → weeks 0…6.
      expect(options).toEqual(['Week 0 (base) · own chart', 'Week 1', 'Week 2', 'Week 3', 'Week 4 · own chart', 'Week 5', 'Week 6']);
      expect(picker().value).toBe('4');
      expect(status()).toBe("Week 4's own chart. In force from week 4 on.");
    });

    it('shows "carried from week 0" for week 2, and saves the dragged order for week 2', async () => {
      await render('coordinator');
      // Week 2 has no chart of its own: the base chart (Pike starting at LG) is in force.
      await pickWeek(2, { ...CHART, week: 2, inForceFromWeek: 0 });
      expect(picker().value).toBe('2');
      expect(status()).toBe('Carried from week 0. Week 2 has no chart of its own. Saving gives week 2 its own chart, in force for weeks 2–3.');
      drop('LG', 1, 'LG', 0);
      await fixture.whenStable();
      expect(picker().disabled).toBe(true);
      expect(element().textContent).toContain('Saves the chart of Week 2');
      const reason = element().querySelector('input[name=reason]') as HTMLInputElement;
      reason.value = 'Lund starts the second game';
      reason.dispatchEvent(new Event('input'));
      (Array.from(element().querySelectorAll('button')).find((b) => b.textContent?.includes('Save the depth chart')) as HTMLButtonElement).click();
      const put = http.expectOne((r) => r.method === 'PUT' && r.url === '/api/teams/1/depth-chart');
      expect(put.request.body).toEqual({ seasonId: 5, week: 2, positions: { LG: [22, 12] }, reason: 'Lund starts the second game' });
      put.flush({ ...CHART, week: 2, inForceFromWeek: 2, savedWeeks: [0, 2, 4], positions: { ...CHART.positions, LG: [CHART.positions['LG'][1], CHART.positions['LG'][0]] } });
      await answer('/api/teams/1/depth-chart/history', HISTORY);
      await fixture.whenStable();
      expect(status()).toBe("Week 2's own chart. In force for weeks 2–3.");
      expect(Array.from(picker().options, (o) => o.textContent?.trim())[2]).toBe('Week 2 · own chart');
      expect(picker().disabled).toBe(false);
    });

    it('says when no chart is in force for a week', async () => {
      await render('coach');
      const empty = Object.fromEntries(Object.keys(CHART.positions).map((p) => [p, []]));
      await pickWeek(1, { ...CHART, week: 1, inForceFromWeek: null, savedWeeks: [3], positions: empty });
      expect(status()).toBe('No chart for week 1. Nothing is saved for it or an earlier week.');
      expect(names('LG')).toEqual([]);
    });
  });
});
