import { comment } from '../study/study-test-data';
import { activePointId, threadsInOrder, toMarkers } from './point-threads';

describe('point threads', () => {
  const threads = threadsInOrder([
    comment({ id: 3, atMs: 4000, endMs: 7000 }),
    comment({ id: 1, atMs: 1000 }),
    comment({ id: 9, parentId: 1, kind: 'reply' }),
    comment({ id: 2, atMs: 2500, hidden: true, body: '(removed)' }),
  ]);

  it('orders threads by moment, leaving replies inside their thread', () => {
    expect(threads.map((t) => t.id)).toEqual([1, 2, 3]);
  });

  it('marks only points that are not removed', () => {
    expect(toMarkers(threads).map((m) => m.id)).toEqual([1, 3]);
  });

  it('knows which point the video is at: a moment for two seconds, a span to its end', () => {
    expect(activePointId(threads, 500)).toBeNull();
    expect(activePointId(threads, 2900)).toBe(1);
    expect(activePointId(threads, 3100)).toBeNull();
    expect(activePointId(threads, 6900)).toBe(3);
    expect(activePointId(threads, 7100)).toBeNull();
  });
});
