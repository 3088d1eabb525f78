import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatDialog, MatDialogRef } from '@angular/material/dialog';
import type { Player } from '@shared/api/roster';
import { PlayerDialog, PlayerDialogData } from './player-dialog';

describe('PlayerDialog', () => {
  let http: HttpTestingController;
  let ref: MatDialogRef<PlayerDialog, Player>;
  let closedWith: Player | undefined | 'open';

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    const data: PlayerDialogData = { teamId: 1, seasonId: 5, player: null };
    ref = TestBed.inject(MatDialog).open<PlayerDialog, PlayerDialogData, Player>(PlayerDialog, { data });
    closedWith = 'open';
    // beforeClosed: afterClosed waits for a close animation that jsdom never plays.
    ref.beforeClosed().subscribe((value) => (closedWith = value));
    await settle();
  });

  afterEach(() => {
    http.verify();
    TestBed.inject(MatDialog).closeAll();
  });

  async function settle(): Promise<void> {
    TestBed.tick();
    await new Promise((resolve) => setTimeout(resolve, 0));
    TestBed.tick();
  }

  function dialogElement(): HTMLElement {
    return document.querySelector('tw-player-dialog') as HTMLElement;
  }

  function type(name: string, value: string): void {
    const input = dialogElement().querySelector(`input[formcontrolname=${name}]`) as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
  }

  function fillValidPlayer(): void {
    type('name', 'Rowan Pike');
    type('jersey', '74');
    const form = ref.componentInstance['form'];
    form.controls.positions.setValue(['LT']);
    form.controls.classYear.setValue('Jr');
    type('height', '6-4');
    type('weight', '288');
  }

  async function submit(): Promise<void> {
    (dialogElement().querySelector('button[type=submit]') as HTMLButtonElement).click();
    await settle();
  }

  it('checks the fields before sending anything', async () => {
    type('jersey', '140');
    type('height', 'tall');
    await submit();
    const text = dialogElement().textContent ?? '';
    expect(text).toContain('Enter a name.');
    expect(text).toContain('Jersey numbers are 0–99.');
    expect(text).toContain('Write the height like 6-4');
    expect(text).toContain('List at least one position.');
    http.expectNone('/api/teams/1/players');
  });

  it('sends the player in API units and closes with the saved entry', async () => {
    fillValidPlayer();
    await submit();
    const request = http.expectOne('/api/teams/1/players');
    expect(request.request.body).toEqual({
      name: 'Rowan Pike',
      jersey: 74,
      positions: ['LT'],
      classYear: 'Jr',
      redshirt: false,
      heightIn: 76,
      weightLb: 288,
      status: 'active',
      seasonId: 5,
    });
    const saved = { ...request.request.body, id: 31, accountEmail: null } as Player;
    request.flush(saved);
    await settle();
    expect(closedWith).toEqual(saved);
  });

  it('shows a jersey conflict next to the jersey field and stays open', async () => {
    fillValidPlayer();
    await submit();
    http
      .expectOne('/api/teams/1/players')
      .flush(
        { error: { code: 'conflict', message: 'Jersey 74 is already worn.', fields: { jersey: 'Tomas Varga already wears 74 this season.' } } },
        { status: 409, statusText: 'Conflict' },
      );
    await settle();
    const jerseyField = dialogElement().querySelector('input[formcontrolname=jersey]')?.closest('mat-form-field') as HTMLElement;
    expect(jerseyField.textContent).toContain('Tomas Varga already wears 74 this season.');
    expect(closedWith).toBe('open');
  });

  it('puts the server 422 field messages on the matching fields', async () => {
    fillValidPlayer();
    await submit();
    http
      .expectOne('/api/teams/1/players')
      .flush(
        { error: { code: 'validation_failed', message: 'Check the fields.', fields: { heightIn: 'Height looks wrong.', name: 'Keep the name under 120 characters.' } } },
        { status: 422, statusText: 'Unprocessable Entity' },
      );
    await settle();
    const heightField = dialogElement().querySelector('input[formcontrolname=height]')?.closest('mat-form-field') as HTMLElement;
    const nameField = dialogElement().querySelector('input[formcontrolname=name]')?.closest('mat-form-field') as HTMLElement;
    expect(heightField.textContent).toContain('Height looks wrong.');
    expect(nameField.textContent).toContain('Keep the name under 120 characters.');
  });
});
