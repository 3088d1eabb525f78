import fc from 'fast-check';
import type { Player } from './api/roster';
import { CLASS_YEARS, PLAYER_STATUSES, POSITIONS } from './roster';
import { checkRosterHeader, ROSTER_CSV_COLUMNS, rosterRecord, validateRosterRecords, type RosterCsvRecord } from './roster-csv';

// Names differ by jersey so that rows of one file never repeat a player (that is its own error).
const good = (over: RosterCsvRecord = {}): RosterCsvRecord => ({
  name: over.jersey && over.jersey !== '70' ? `Avery Lintel ${over.jersey}` : 'Avery Lintel',
  jersey: '70',
  positions: 'LT',
  class: 'Jr',
  redshirt: 'no',
  height: '6-4',
  weight: '295',
  status: 'active',
  ...over,
});

describe('validateRosterRecords', () => {
  test('a good record becomes a player input with parsed values', () => {
    const { rows, errors } = validateRosterRecords([good()]);
    expect(errors).toEqual([]);
    expect(rows).toEqual([
      { name: 'Avery Lintel', jersey: 70, positions: ['LT'], classYear: 'Jr', redshirt: false, heightIn: 76, weightLb: 295, status: 'active' },
    ]);
  });

  test('row numbers count the header as row 1: the first record is row 2', () => {
    const { errors } = validateRosterRecords([good({ jersey: '1' }), good({ jersey: '2' }), good({ jersey: 'x' }), good({ jersey: '4' }), good({ jersey: 'y' })]);
    expect(errors.map((e) => e.row)).toEqual([4, 6]);
    expect(errors.every((e) => e.field === 'jersey')).toBe(true);
  });

  test('a jersey used twice in the file: the later row is reported, naming the earlier one', () => {
    const { rows, errors } = validateRosterRecords([good({ name: 'A One', jersey: '70' }), good({ name: 'B Two', jersey: '71' }), good({ name: 'C Three', jersey: '70' })]);
    expect(errors).toEqual([{ row: 4, field: 'jersey', message: 'Jersey 70 is also on row 2.' }]);
    expect(rows.map((r) => r.name)).toEqual(['A One', 'B Two']);
  });

  test.each([
    ['name', { name: '' }, 'Enter a name.'],
    ['jersey', { jersey: 'abc' }, 'Jersey must be a number.'],
    ['jersey', { jersey: '' }, 'Jersey must be a number.'],
    ['jersey', { jersey: '100' }, 'Jersey must be 0–99.'],
    ['jersey', { jersey: '-1' }, 'Jersey must be 0–99.'],
    ['jersey', { jersey: '7.5' }, 'Jersey must be a whole number.'],
    ['positions', { positions: 'QB' }, 'Positions are LT, LG, C, RG, RT, TE.'],
    ['positions', { positions: '' }, 'List at least one position.'],
    ['positions', { positions: 'LT LT' }, 'A position is listed twice.'],
    ['class', { class: 'Xx' }, 'Class year is one of Fr, So, Jr, Sr, Gr.'],
    ['redshirt', { redshirt: 'maybe' }, 'Redshirt is yes or no.'],
    ['height', { height: 'tall' }, 'Height is like 6-4 or 76 (inches).'],
    ['height', { height: '40' }, 'Height looks wrong.'],
    ['weight', { weight: 'heavy' }, 'Weight is a number of pounds.'],
    ['weight', { weight: '900' }, 'Weight looks wrong.'],
    ['status', { status: 'retired' }, 'Status is one of active, injured, inactive.'],
  ])('column %s: %j → %j', (field, over, message) => {
    const { rows, errors } = validateRosterRecords([good(over)]);
    expect(errors).toEqual([{ row: 2, field, message }]);
    expect(rows).toEqual([]);
  });

  test('several bad columns in one row: one error per column, all reported', () => {
    const { errors } = validateRosterRecords([good({ jersey: '120', positions: 'XX', redshirt: 'perhaps', status: 'gone' })]);
    expect(errors.map((e) => `${e.row}:${e.field}`).sort()).toEqual(['2:jersey', '2:positions', '2:redshirt', '2:status']);
  });

  test('normalisation: positions in any case and separator, yes/no spellings, empty optional cells', () => {
    const { rows, errors } = validateRosterRecords([
      good({ positions: 'lt/lg', redshirt: 'RS', height: '', weight: '', status: '' }),
      good({ jersey: '71', positions: 'C;RG | RT', redshirt: 'Y', status: 'Injured', height: '76' }),
      { name: 'Only Required', jersey: '72', positions: 'TE', class: 'So' },
    ]);
    expect(errors).toEqual([]);
    expect(rows[0]).toMatchObject({ positions: ['LT', 'LG'], redshirt: true, heightIn: null, weightLb: null, status: 'active' });
    expect(rows[1]).toMatchObject({ positions: ['C', 'RG', 'RT'], redshirt: true, heightIn: 76, status: 'injured' });
    expect(rows[2]).toMatchObject({ redshirt: false, heightIn: null, weightLb: null, status: 'active' });
  });

  // The class column takes the codes and, as the normaliser intends, the full words a roster sheet uses.
  test.each([
    ['fr', 'Fr'],
    ['SR', 'Sr'],
    ['Freshman', 'Fr'],
    ['Sophomore', 'So'],
    ['Junior', 'Jr'],
    ['Senior', 'Sr'],
    ['Graduate', 'Gr'],
  ])('class %j → %j', (text, classYear) => {
    const { rows, errors } = validateRosterRecords([good({ class: text })]);
    expect(errors).toEqual([]);
    expect(rows[0]!.classYear).toBe(classYear);
  });
});

describe('checkRosterHeader', () => {
  test('our columns in any order and case → no problem', () => {
    expect(checkRosterHeader(['Status', 'NAME', 'jersey', 'positions', 'class'])).toEqual([]);
    expect(checkRosterHeader([...ROSTER_CSV_COLUMNS])).toEqual([]);
  });

  test('a missing required column and an unknown column are reported on row 1', () => {
    const errors = checkRosterHeader(['name', 'jersey', 'class', 'shoe size']);
    expect(errors.map((e) => [e.row, e.field])).toEqual([
      [1, 'positions'],
      [1, 'shoe size'],
    ]);
  });
});

describe('rosterRecord (export) round-trips through validateRosterRecords (import)', () => {
  const player = (over: Partial<Player> = {}): Player => ({
    id: 1,
    name: 'Dane "Tank" Holloway, Jr.',
    jersey: 55,
    positions: ['RG', 'RT'],
    classYear: 'So',
    redshirt: true,
    heightIn: 77,
    weightLb: 301,
    status: 'injured',
    seasonId: 1,
    accountEmail: null,
    ...over,
  });

  test('one player, in our column order', () => {
    const record = rosterRecord(player());
    expect(Object.keys(record)).toEqual([...ROSTER_CSV_COLUMNS]);
    expect(record).toEqual({ name: 'Dane "Tank" Holloway, Jr.', jersey: '55', positions: 'RG RT', class: 'So', redshirt: 'yes', height: '6-5', weight: '301', status: 'injured' });
    expect(rosterRecord(player({ heightIn: null, weightLb: null, redshirt: false })).height).toBe('');
  });

  test('any valid player', () => {
    const arbitraryPlayer = fc.record({
      name: fc.string({ minLength: 1, maxLength: 40 }).map((s) => s.replace(/[\u0000-\u001f]/g, '').trim()).filter((s) => s.length > 0),
      jersey: fc.integer({ min: 0, max: 99 }),
      positions: fc.uniqueArray(fc.constantFrom(...POSITIONS), { minLength: 1, maxLength: POSITIONS.length }),
      classYear: fc.constantFrom(...CLASS_YEARS),
      redshirt: fc.boolean(),
      heightIn: fc.option(fc.integer({ min: 48, max: 96 }), { nil: null }),
      weightLb: fc.option(fc.integer({ min: 100, max: 500 }), { nil: null }),
      status: fc.constantFrom(...PLAYER_STATUSES),
    });
    fc.assert(
      fc.property(arbitraryPlayer, (p) => {
        const { rows, errors } = validateRosterRecords([rosterRecord(player(p))]);
        expect(errors).toEqual([]);
        expect(rows).toEqual([p]);
      }),
    );
  });
});

describe('repeated names in one file', () => {
  test('the second row with the same name is reported, naming the first', () => {
    const { errors, rows } = validateRosterRecords([
      { name: 'Avery Lintel', jersey: '70', positions: 'LT', class: 'Jr' },
      { name: 'avery lintel', jersey: '71', positions: 'LG', class: 'Jr' },
    ]);
    expect(errors).toEqual([{ row: 3, field: 'name', message: 'avery lintel is also on row 2.' }]);
    expect(rows).toHaveLength(1);
  });
});
