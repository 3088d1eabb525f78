import { defuseCell, restoreCell } from './csv-cells';

// OWASP "CSV Injection": cells starting with = + - @ tab or CR are run as formulas by spreadsheet
// programs; the usual defence is a leading apostrophe (OWASP cheat sheet, from memory).
describe('defuseCell', () => {
  test.each([
    ['=HYPERLINK("x")', `'=HYPERLINK("x")`],
    ['+1+1', `'+1+1`],
    ['-cmd', `'-cmd`],
    ['@SUM(A1)', `'@SUM(A1)`],
    ['\tTab', `'\tTab`],
    ['Tobin Hask', 'Tobin Hask'],
  ])('%j → %j', (input, expected) => {
    expect(defuseCell(input)).toBe(expected);
    expect(restoreCell(defuseCell(input))).toBe(input);
  });

  test('numbers stay numbers, negative gains included', () => {
    expect(defuseCell(-3)).toBe('-3');
    expect(defuseCell('-3')).toBe('-3');
    expect(defuseCell(null)).toBe('');
  });

  test('an apostrophe that does not guard a formula is kept', () => {
    expect(restoreCell("'Bama")).toBe("'Bama");
  });
});
