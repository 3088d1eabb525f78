import { StudyReportRow, behind, ofWords, sortReport } from './study-report-rows';

const row = (playerId: number, jersey: number | null, clips: number, watched: number, points: number, acknowledged: number): StudyReportRow => ({
  playerId,
  name: `Player ${playerId}`,
  jersey,
  clips,
  watched,
  points,
  acknowledged,
});

describe('study report rows', () => {
  const rows = [row(1, 74, 4, 3, 5, 5), row(2, 70, 2, 2, 2, 0), row(3, 55, 0, 0, 0, 0), row(4, null, 4, 1, 4, 4)];

  it('sorts watched by share, not count, with nothing to watch counted as done', () => {
    expect(sortReport(rows, 'watched', 'asc').map((r) => r.playerId)).toEqual([4, 1, 3, 2]);
    expect(sortReport(rows, 'watched', 'desc').map((r) => r.playerId)).toEqual([3, 2, 1, 4]);
  });

  it('sorts by jersey for the player column, without a jersey last', () => {
    expect(sortReport(rows, 'player', 'asc').map((r) => r.jersey)).toEqual([55, 70, 74, null]);
  });

  it('puts it in words and says who is behind', () => {
    expect(ofWords(3, 4, 'watched', 'no clips')).toBe('3 of 4 watched');
    expect(ofWords(0, 0, 'watched', 'no clips')).toBe('no clips');
    expect(rows.map(behind)).toEqual([true, true, false, true]);
  });
});
