import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatDialog, MatDialogRef } from '@angular/material/dialog';
import type { FilmSession } from '@shared/api/film';
import { filmSession } from './film-test-data';
import { NewSessionData, NewSessionDialog } from './new-session-dialog';

describe('NewSessionDialog', () => {
  let http: HttpTestingController;
  let closedWith: FilmSession | undefined | 'open';

  async function open(kind: NewSessionData['kind']): Promise<MatDialogRef<NewSessionDialog, FilmSession>> {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    const ref = TestBed.inject(MatDialog).open<NewSessionDialog, NewSessionData, FilmSession>(NewSessionDialog, { data: { teamId: 1, seasonId: 5, kind } });
    closedWith = 'open';
    // beforeClosed: afterClosed waits for a close animation that jsdom never plays.
    ref.beforeClosed().subscribe((value) => (closedWith = value));
    await settle();
    return ref;
  }

  afterEach(() => {
    http.verify();
    TestBed.inject(MatDialog).closeAll();
  });

  async function settle(): Promise<void> {
    TestBed.tick();
    await new Promise((resolve) => setTimeout(resolve, 0));
    TestBed.tick();
  }

  const dialog = () => document.querySelector('tw-new-session-dialog') as HTMLElement;

  function type(name: string, value: string): void {
    const input = dialog().querySelector(`input[formcontrolname=${name}]`) as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
  }

  async function submit(): Promise<void> {
    (dialog().querySelector('button[type=submit]') as HTMLButtonElement).click();
    await settle();
  }

  it('asks a game for its opponent and titles it from the week and opponent', async () => {
    await open('game');
    type('date', '2026-09-18');
    type('week', '3');
    await submit();
    expect(dialog().textContent).toContain('A game needs an opponent.');
    http.expectNone('/api/film-sessions');

    type('opponent', 'Saltmarsh Herons');
    await settle();
    await submit();
    const request = http.expectOne('/api/film-sessions');
    expect(request.request.body).toEqual({
      teamId: 1,
      seasonId: 5,
      kind: 'game',
      title: 'Week 3 vs Saltmarsh Herons',
      date: '2026-09-18',
      opponent: 'Saltmarsh Herons',
      homeAway: null,
      week: 3,
      periods: [],
    });
    const created = filmSession({ id: 8, title: 'Week 3 vs Saltmarsh Herons' });
    request.flush(created, { status: 201, statusText: 'Created' });
    await settle();
    expect(closedWith).toEqual(created);
  });

  it('sends practice periods and puts the server 422 field messages on the fields', async () => {
    await open('practice');
    type('title', 'Thursday walk-through');
    const ideas = Array.from(dialog().querySelectorAll<HTMLButtonElement>('.ideas button'));
    ideas.find((b) => b.textContent?.includes('inside run'))!.click();
    ideas.find((b) => b.textContent?.includes('1-on-1 pass pro'))!.click();
    await settle();
    await submit();
    const request = http.expectOne('/api/film-sessions');
    expect(request.request.body).toEqual(expect.objectContaining({ kind: 'practice', title: 'Thursday walk-through', opponent: null, periods: ['inside run', '1-on-1 pass pro'] }));
    request.flush(
      { error: { code: 'validation_failed', message: 'Check the fields.', fields: { date: 'Use a date like 2026-09-04.', periods: 'At most 40 periods.' } } },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await settle();
    const dateField = dialog().querySelector('input[formcontrolname=date]')?.closest('mat-form-field') as HTMLElement;
    expect(dateField.textContent).toContain('Use a date like 2026-09-04.');
    expect(dialog().textContent).toContain('At most 40 periods.');
    expect(closedWith).toBe('open');
  });
});
