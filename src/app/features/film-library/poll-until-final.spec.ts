import { HttpErrorResponse } from '@angular/common/http';
import { Observable, of, throwError } from 'rxjs';
import { PollState, pollUntilFinal } from './poll-until-final';

describe('pollUntilFinal', () => {
  beforeEach(() => jest.useFakeTimers());
  afterEach(() => jest.useRealTimers());

  function run<T>(answers: (() => Observable<T>)[], isFinal: (value: T) => boolean) {
    let calls = 0;
    const states: PollState<T>[] = [];
    let completed = false;
    pollUntilFinal(() => answers[Math.min(calls++, answers.length - 1)](), isFinal, 2000).subscribe({
      next: (state) => states.push(state),
      complete: () => (completed = true),
    });
    return { states, calls: () => calls, completed: () => completed };
  }

  it('asks every 2 s until the answer is final, then stops', () => {
    const poll = run([() => of('processing'), () => of('processing'), () => of('ready')], (s) => s === 'ready');
    jest.advanceTimersByTime(0);
    expect(poll.calls()).toBe(1);
    jest.advanceTimersByTime(1999);
    expect(poll.calls()).toBe(1);
    jest.advanceTimersByTime(1);
    expect(poll.calls()).toBe(2);
    jest.advanceTimersByTime(2000);
    expect(poll.states.map((s) => s.value)).toEqual(['processing', 'processing', 'ready']);
    expect(poll.completed()).toBe(true);
    jest.advanceTimersByTime(10_000);
    expect(poll.calls()).toBe(3);
  });

  it('keeps the last good answer through a dropped connection and goes on', () => {
    const offline = () => throwError(() => new HttpErrorResponse({ status: 0 }));
    const poll = run([() => of('processing'), offline, () => of('ready')], (s) => s === 'ready');
    jest.advanceTimersByTime(4000);
    expect(poll.states[1]).toEqual({ value: 'processing', error: expect.objectContaining({ code: 'network' }) });
    expect(poll.states[2]).toEqual({ value: 'ready', error: null });
    expect(poll.completed()).toBe(true);
  });

  it('stops on a lasting error such as 404', () => {
    const gone = () => throwError(() => new HttpErrorResponse({ status: 404, error: { error: { code: 'not_found', message: 'That film session was not found.' } } }));
    const poll = run([gone], () => false);
    jest.advanceTimersByTime(10_000);
    expect(poll.calls()).toBe(1);
    expect(poll.states[0].error?.message).toBe('That film session was not found.');
    expect(poll.completed()).toBe(true);
  });
});
