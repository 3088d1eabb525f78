import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { sessionFor } from '../../../testing/sessions';
import { waitFor } from '../../../testing/wait-for';
import { filmSession } from '../film-library/film-test-data';
import { gradeSheet, scheme, sheetPlayer } from '../grading-desk/grading-test-data';
import { GradeSheetPage } from './grade-sheet-page';

describe('GradeSheetPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<GradeSheetPage>;

  const PLAYERS = [
    sheetPlayer(),
    sheetPlayer({ playerId: 13, name: 'Eli Brandt', jersey: 55, positions: ['C'], snaps: 50, plus: 43, plusRate: 0.86, meetsWinningGrade: true, notes: [] }),
    sheetPlayer({ playerId: 16, name: 'Jonah Reyes', jersey: 88, positions: ['TE'], snaps: 0, plus: 0, plusRate: null, meetsWinningGrade: null, notes: [] }),
  ];

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(AuthStore).setSession(sessionFor('coach'));
    fixture = TestBed.createComponent(GradeSheetPage);
    fixture.componentRef.setInput('sessionId', '3');
    const answer = async (url: string, body: object) => (await waitFor(() => (TestBed.tick(), http.match(url)[0]), url)).flush(body);
    await answer('/api/film-sessions/3', filmSession());
    await answer('/api/film-sessions/3/grade-sheet', gradeSheet(PLAYERS));
    await answer('/api/teams/1/grading-scheme', scheme());
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const card = (name: string) => Array.from(element().querySelectorAll('tw-player-sheet-card')).find((c) => c.textContent?.includes(name)) as HTMLElement;

  it('shows each player\'s plus % and the winning-grade line in words', () => {
    const varga = card('Tomas Varga');
    expect(varga.querySelector('[data-testid=plus-rate]')?.textContent?.trim()).toBe('79 %');
    expect(varga.querySelector('[data-testid=winning-line]')?.textContent).toContain('Winning grade 80 %: not met');
    expect(varga.textContent).toContain('46 of 58 graded snaps');
    expect(card('Eli Brandt').querySelector('[data-testid=winning-line]')?.textContent).toContain('Winning grade 80 %: met');
    expect(card('Jonah Reyes').querySelector('[data-testid=winning-line]')?.textContent).toContain('no graded snaps yet');
  });

  it('lists each part\'s plus %, the team\'s own part by name, missed reasons, penalties and notes', () => {
    const rows = Array.from(card('Tomas Varga').querySelectorAll('table.parts tbody tr'), (tr) =>
      Array.from(tr.children, (cell) => cell.textContent?.trim()).join(' '),
    );
    expect(rows).toEqual(['Assignment 55 3 95 %', 'Footwork 50 8 86 %', 'Hands 49 9 84 %', 'Pad level 52 6 90 %', 'Finish 40 18 69 %', 'Effort 57 1 98 %']);
    const text = card('Tomas Varga').textContent ?? '';
    expect(text).toContain('wrong gap or man: 2');
    expect(text).toContain('holding: 1');
    expect(text).toContain('Snap 12: Punch late on the double');
  });

  it('shows the whole line snap by snap, naming who graded minus', async () => {
    (Array.from(element().querySelectorAll('button')).find((b) => b.textContent?.includes('Whole line')) as HTMLButtonElement).click();
    await fixture.whenStable();
    const unit = element().querySelector('tw-unit-sheet')?.textContent ?? '';
    expect(unit).toContain('50 %');
    expect(unit).toContain('✓ all plus');
    expect(unit).toContain('✗ not all plus');
    expect(unit).toContain('#55 Eli Brandt');
    // Snap 2: five of five graded, four plus; the one minus is the weakest link.
    const snap2 = Array.from(element().querySelectorAll('tw-unit-sheet tbody tr'))[1]!;
    const cells = Array.from(snap2.querySelectorAll('td')).map((c) => c.textContent?.trim());
    expect(cells).toEqual(['5 of 5', '4', '✗ not all plus', '#55 Eli Brandt', '#55 Eli Brandt']);
  });

  it('has a CSV link and a print stylesheet that hides the app around the sheet', () => {
    const csv = element().querySelector('a[download]') as HTMLAnchorElement;
    expect(csv.getAttribute('href')).toBe('/api/film-sessions/3/grade-sheet.csv');
    expect(csv.getAttribute('download')).toBe('grade-sheet.csv');
    expect(document.body.classList).toContain('tw-printing-sheet');
    const css = Array.from(document.head.querySelectorAll('style'), (s) => s.textContent ?? '').join('\n');
    expect(css).toMatch(/@media print/);
    expect(css).toMatch(/body\.tw-printing-sheet \.mat-toolbar/);
    expect(css).toMatch(/\.grade-sheet\.page-per-player tw-player-sheet-card\s*\{\s*break-after:\s*page/);
    expect(element().querySelector('.grade-sheet')).not.toBeNull();
    fixture.destroy();
    expect(document.body.classList).not.toContain('tw-printing-sheet');
  });

  it('mails a player his sheet after a confirmation', async () => {
    const button = Array.from(card('Eli Brandt').querySelectorAll('button')).find((b) => b.textContent?.includes('Mail to player')) as HTMLButtonElement;
    button.click();
    const confirm = await waitFor(() => Array.from(document.querySelectorAll('mat-dialog-container button')).find((b) => b.textContent?.includes('Send it')) as HTMLButtonElement | undefined, 'the confirmation');
    expect(document.querySelector('mat-dialog-container')?.textContent).toContain('Mail the grade sheet to Eli Brandt?');
    http.expectNone('/api/film-sessions/3/grade-sheet/mail');
    confirm.click();
    const mail = await waitFor(() => http.match('/api/film-sessions/3/grade-sheet/mail')[0], 'the mail request');
    expect(mail.request.method).toBe('POST');
    expect(mail.request.body).toEqual({ playerId: 13 });
    mail.flush(null, { status: 202, statusText: 'Accepted' });
    await waitFor(() => document.body.textContent?.includes('on its way to Eli Brandt'), 'the notice');
  });
});
