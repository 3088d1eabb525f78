import { HttpEventType, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { waitFor } from '../../../testing/wait-for';
import { clip } from './film-test-data';
import { UploadPanel } from './upload-panel';

const UPLOAD_URL = '/api/film-sessions/3/clips';

function file(name: string, bytes: number, type = 'video/mp4'): File {
  return new File(['x'.repeat(bytes)], name, { type });
}

describe('UploadPanel', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<UploadPanel>;
  let uploadedEvents: number;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(UploadPanel);
    fixture.componentRef.setInput('sessionId', 3);
    uploadedEvents = 0;
    fixture.componentInstance.uploaded.subscribe(() => uploadedEvents++);
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;

  async function pick(...files: File[]): Promise<void> {
    const input = element().querySelector('[data-testid=upload-files]') as HTMLInputElement;
    Object.defineProperty(input, 'files', { value: files, configurable: true });
    input.dispatchEvent(new Event('change'));
    await fixture.whenStable();
  }

  async function chooseAngle(label: string): Promise<void> {
    const buttons = Array.from(element().querySelectorAll<HTMLButtonElement>('mat-button-toggle button'));
    buttons.find((b) => b.textContent?.trim() === label)!.click();
    await fixture.whenStable();
  }

  function uploads(): TestRequest[] {
    return http.match((r) => r.url === UPLOAD_URL && r.method === 'POST');
  }

  function items(): string[] {
    return Array.from(element().querySelectorAll('[data-testid=upload-item]'), (li) => (li.textContent ?? '').replace(/\s+/g, ' ').trim());
  }

  it('sends each file in its own request with the chosen angle and kind, two at a time', async () => {
    await chooseAngle('End zone');
    await pick(file('play_001.mp4', 100), file('play_002.mp4', 100), file('play_003.mp4', 100));

    const first = uploads();
    expect(first).toHaveLength(2);
    for (const [i, request] of first.entries()) {
      const body = request.request.body as FormData;
      expect(body.get('angle')).toBe('end_zone');
      expect(body.get('kind')).toBe('snap');
      expect(body.getAll('files')).toHaveLength(1);
      expect((body.get('files') as File).name).toBe(`play_00${i + 1}.mp4`);
      expect(request.request.reportProgress).toBe(true);
    }

    first[0].flush({ clips: [{ id: 41, status: 'received', originalName: 'play_001.mp4', snapId: 7 }], skipped: [] });
    await fixture.whenStable();
    const third = await waitFor(() => uploads()[0], 'the third upload');
    expect((third.request.body as FormData).get('files')).toHaveProperty('name', 'play_003.mp4');
    expect(uploadedEvents).toBe(1);

    first[1].flush({ clips: [{ id: 42, status: 'received', originalName: 'play_002.mp4', snapId: 8 }], skipped: [] });
    third.flush({ clips: [{ id: 43, status: 'received', originalName: 'play_003.mp4', snapId: 9 }], skipped: [] });
    await fixture.whenStable();
    expect(items().every((text) => text.includes('Received'))).toBe(true);
    // Once the page's poll has the clip, the row follows its processing.
    fixture.componentRef.setInput('clips', [clip({ id: 41, status: 'processing', progress: 30 }), clip({ id: 42 })]);
    await fixture.whenStable();
    expect(items()[0]).toContain('Processing 30%');
    expect(items()[1]).toContain('Ready');
    expect(items()[0]).toContain('End zone');
    expect(element().querySelector('[data-testid=upload-overall]')?.textContent).toContain('3 of 3 files done · 100% sent');
  });

  it('shows progress per file and overall while sending', async () => {
    await pick(file('tape.mov', 200), file('other.mov', 200));
    const [tape, other] = uploads();
    tape.event({ type: HttpEventType.UploadProgress, loaded: 50, total: 200 });
    other.event({ type: HttpEventType.UploadProgress, loaded: 150, total: 200 });
    await fixture.whenStable();
    expect(items()[0]).toContain('Sending 25%');
    expect(items()[1]).toContain('Sending 75%');
    expect(element().querySelector('[data-testid=upload-overall]')?.textContent).toContain('0 of 2 files done · 50% sent');
    const bars = element().querySelectorAll('[data-testid=upload-item] mat-progress-bar');
    expect(bars[0].getAttribute('aria-valuenow')).toBe('25');
    expect(fixture.componentInstance.uploadsRunning()).toBe(true);

    // Cancel aborts the request; the file can be sent again.
    (element().querySelector('[aria-label="Cancel tape.mov"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    expect(tape.cancelled).toBe(true);
    expect(items()[0]).toContain('Cancelled');
    (element().querySelector('[aria-label="Send tape.mov again"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    const again = uploads().find((r) => (r.request.body as FormData).get('files') instanceof File && ((r.request.body as FormData).get('files') as File).name === 'tape.mov');
    expect(again).toBeDefined();
    again!.flush({ clips: [{ id: 50, status: 'received', originalName: 'tape.mov', snapId: null }], skipped: [] });
    other.flush({ clips: [{ id: 51, status: 'received', originalName: 'other.mov', snapId: null }], skipped: [] });
    await fixture.whenStable();
    expect(fixture.componentInstance.uploadsRunning()).toBe(false);
  });

  it("shows a refused file with the server's reason, a skipped duplicate and a file over the limit", async () => {
    await pick(file('notes.txt', 10, 'text/plain'), file('play_001.mp4', 10));
    const [refused, duplicate] = uploads();
    refused.flush({ clips: [{ id: 60, status: 'failed', originalName: 'notes.txt', snapId: null }], skipped: [] });
    duplicate.flush({ clips: [], skipped: [{ originalName: 'play_001.mp4', reason: 'the same file is already in this session', duplicateOfClipId: 41 }] });
    await fixture.whenStable();
    // The reason comes with the session's clip list, which the page polls.
    fixture.componentRef.setInput('clips', [clip({ id: 60, status: 'failed', failureReason: 'this is not a video file (it looks like text)' })]);
    await fixture.whenStable();
    const [refusedText, duplicateText] = items();
    expect(refusedText).toContain('Refused: this is not a video file (it looks like text)');
    expect(duplicateText).toContain('Skipped: the same file is already in this session.');

    await pick(file('whole-game.mp4', 10));
    uploads()[0].flush(
      { error: { code: 'payload_too_large', message: 'A file is larger than the upload limit (4 GiB). Nothing from this upload was kept.' } },
      { status: 413, statusText: 'Payload Too Large' },
    );
    await fixture.whenStable();
    const tooBig = items()[2];
    expect(tooBig).toContain('Not sent');
    expect(tooBig).toContain('larger than the upload limit (4 GiB)');
    expect(element().querySelector('[aria-label="Send whole-game.mp4 again"]')).toBeNull();
  });

  it('says that closing the page stops uploads, and asks the browser to warn while they run', async () => {
    expect(element().textContent).toContain('Closing or leaving it stops the uploads still running');
    const idle = new Event('beforeunload', { cancelable: true });
    window.dispatchEvent(idle);
    expect(idle.defaultPrevented).toBe(false);

    await pick(file('play_009.mp4', 10));
    const busy = new Event('beforeunload', { cancelable: true });
    window.dispatchEvent(busy);
    expect(busy.defaultPrevented).toBe(true);
    uploads()[0].flush({ clips: [{ id: 70, status: 'received', originalName: 'play_009.mp4', snapId: 1 }], skipped: [] });
  });
});
