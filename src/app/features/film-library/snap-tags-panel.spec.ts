import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Snap } from '@shared/api/film';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { TAG_ITEMS, pressKey, snap } from './film-test-data';
import { SnapTagsPanel } from './snap-tags-panel';

describe('SnapTagsPanel', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<SnapTagsPanel>;
  let saved: (readonly Snap[])[];

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SnapTagsPanel);
    fixture.componentRef.setInput('sessionId', 3);
    fixture.componentRef.setInput('targets', [snap({ id: 21, order: 4, quarter: 1, conceptId: 103 })]);
    fixture.componentRef.setInput('tagItems', TAG_ITEMS);
    saved = [];
    fixture.componentInstance.saved.subscribe((snaps) => saved.push(snaps));
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const status = () => element().querySelector('.status')?.textContent?.replace(/\s+/g, ' ').trim() ?? '';

  /** Saves finish in a promise callback, after the flush; let it run, then render. */
  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve, 0));
    await fixture.whenStable();
  }

  async function press(key: string, init: KeyboardEventInit = {}, target?: EventTarget): Promise<KeyboardEvent> {
    const event = pressKey(key, init, target);
    await fixture.whenStable();
    return event;
  }

  it('sets the down with a number key and saves only that change with Enter', async () => {
    expect(status()).toContain('No changes');
    const key = await press('3');
    expect(key.defaultPrevented).toBe(true);
    expect(status()).toContain('Unsaved changes');
    expect(element().querySelector('[data-field=down]')?.textContent).toContain('3');

    await press('Enter');
    const request = http.expectOne('/api/snaps/21');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ down: 3 });
    request.flush(snap({ id: 21, order: 4, quarter: 1, conceptId: 103, down: 3 }));
    await settle();
    expect(status()).toContain('Saved');
    expect(saved).toEqual([[expect.objectContaining({ id: 21, down: 3 })]]);
  });

  it('cycles quarter and hash with letters and types personnel after P', async () => {
    await press('q'); // 1 → 2
    await press('h'); // none → left
    await press('p');
    const personnel = element().querySelector('[data-field=personnel]') as HTMLInputElement;
    expect(document.activeElement).toBe(personnel);
    // Letters typed in a field are text, not shortcuts.
    const typed = await press('q', {}, personnel);
    expect(typed.defaultPrevented).toBe(false);
    personnel.value = '12';
    personnel.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(element().textContent).toContain('1 back, 2 tight ends, 2 receivers');

    await press('Enter', {}, personnel);
    const request = http.expectOne('/api/snaps/21');
    expect(request.request.body).toEqual({ quarter: 2, hash: 'left', personnel: '12' });
    request.flush(snap({ id: 21, order: 4, quarter: 2, hash: 'left', personnel: '12', conceptId: 103 }));
    await settle();
    expect(status()).toContain('Saved');
  });

  it('checks personnel before sending and shows the server messages on the fields', async () => {
    await press('p');
    const personnel = element().querySelector('[data-field=personnel]') as HTMLInputElement;
    personnel.value = '7';
    personnel.dispatchEvent(new Event('input'));
    await press('Enter', {}, personnel);
    http.expectNone('/api/snaps/21');
    expect(element().textContent).toContain('Personnel is two digits');

    personnel.value = '11';
    personnel.dispatchEvent(new Event('input'));
    await press('Escape', {}, personnel);
    await press('y');
    const yard = element().querySelector('[data-field=yardLine]') as HTMLInputElement;
    yard.value = '70';
    yard.dispatchEvent(new Event('input'));
    await press('Enter', {}, yard);
    http
      .expectOne('/api/snaps/21')
      .flush(
        { error: { code: 'validation_failed', message: 'Check the marked fields.', fields: { yardLine: 'Yard line is 1–50.' } } },
        { status: 422, statusText: 'Unprocessable Entity' },
      );
    await settle();
    expect(yard.closest('mat-form-field')?.textContent).toContain('Yard line is 1–50.');
    expect(status()).toContain('Not saved: Check the marked fields.');
  });

  it('offers active list items plus a retired one the snap already has', async () => {
    (element().querySelector('[data-field=conceptId]') as HTMLElement).click();
    await fixture.whenStable();
    const options = Array.from(document.querySelectorAll('mat-option'), (o) => o.textContent?.trim());
    expect(options).toEqual(['—', 'inside zone', 'power', 'iso (retired)']);
  });

  it('applies only the changed fields to every selected snap in bulk', async () => {
    fixture.componentRef.setInput('targets', [snap({ id: 21, order: 4 }), snap({ id: 22, order: 5, hash: 'right' }), snap({ id: 23, order: 6 })]);
    await fixture.whenStable();
    expect(element().textContent).toContain('3 snaps (4–6)');
    await press('h');
    await press('Enter');
    const request = http.expectOne('/api/film-sessions/3/snaps/bulk-tags');
    expect(request.request.body).toEqual({ snapIds: [21, 22, 23], tags: { hash: 'left' } });
    request.flush({ snaps: [snap({ id: 21, order: 4, hash: 'left' }), snap({ id: 22, order: 5, hash: 'left' }), snap({ id: 23, order: 6, hash: 'left' })] });
    await settle();
    expect(saved[0]).toHaveLength(3);
    expect(status()).toContain('Saved');
  });
});
