import fc from 'fast-check';
import { CLASS_YEARS, formatHeight, JERSEY_MAX, JERSEY_MIN, parseHeight, PLAYER_STATUSES, POSITIONS } from './roster';

// Heights are written feet-inches ("6-4" = 76 inches): common practice, no source.
describe('parseHeight', () => {
  test.each([
    ['6-4', 76],
    ["6'4", 76],
    ['6\'4"', 76],
    ["6' 4\"", 76],
    ['6 4', 76],
    ['6-04', 76],
    ['5-11', 71],
    ['6-0', 72],
    ['76', 76],
    [' 6-4 ', 76],
  ])('%j → %d inches', (text, inches) => {
    expect(parseHeight(text)).toBe(inches);
  });

  test.each(['', '   ', 'tall', '6-12', '6-4-1', '7', '100', '6.4', '-6-4', '6ft4'])('%j → null', (text) => {
    expect(parseHeight(text)).toBeNull();
  });
});

describe('formatHeight', () => {
  test.each([
    [76, '6-4'],
    [72, '6-0'],
    [71, '5-11'],
    [84, '7-0'],
  ])('%d inches → %j', (inches, text) => {
    expect(formatHeight(inches)).toBe(text);
  });

  test('no height → empty text', () => {
    expect(formatHeight(null)).toBe('');
    expect(formatHeight(undefined)).toBe('');
  });
});

describe('round trip', () => {
  test('6-4 ↔ 76 inches', () => {
    expect(formatHeight(parseHeight('6-4'))).toBe('6-4');
    expect(parseHeight(formatHeight(76))).toBe(76);
  });

  test('every height the roster accepts (48–96 in) survives format → parse', () => {
    fc.assert(fc.property(fc.integer({ min: 48, max: 96 }), (inches) => parseHeight(formatHeight(inches)) === inches));
  });

  test('every feet-inches text survives parse → format', () => {
    fc.assert(
      fc.property(fc.integer({ min: 4, max: 8 }), fc.integer({ min: 0, max: 11 }), (feet, inches) => formatHeight(parseHeight(`${feet}-${inches}`)) === `${feet}-${inches}`),
    );
  });
});

describe('vocabulary', () => {
  test('the five interior positions left to right, then the tight end (common practice, no source)', () => {
    expect(POSITIONS).toEqual(['LT', 'LG', 'C', 'RG', 'RT', 'TE']);
  });

  test('class years, statuses and the jersey range', () => {
    expect(CLASS_YEARS).toEqual(['Fr', 'So', 'Jr', 'Sr', 'Gr']);
    expect(PLAYER_STATUSES).toEqual(['active', 'injured', 'inactive']);
    expect([JERSEY_MIN, JERSEY_MAX]).toEqual([0, 99]);
  });
});
