import { CLASS_YEAR_LABELS, CLASS_YEARS, POSITIONS, PLAYER_STATUSES, ROSTER_CSV_COLUMNS, parseHeight, formatHeight, type RosterCsvColumn } from './roster';
import { defuseCell, restoreCell } from './csv-cells';
import { playerInputSchema, type PlayerInput, type Player, type RosterImportRowError } from './api/roster';

export { ROSTER_CSV_COLUMNS, type RosterCsvColumn };
export type RosterCsvRecord = Partial<Record<RosterCsvColumn, string>>;

const YES = new Set(['yes', 'y', 'true', '1', 'rs']);
const NO = new Set(['', 'no', 'n', 'false', '0']);

// Maps the input schema's field names to our CSV column names, so errors name the column the user sees.
const FIELD_TO_COLUMN: Record<string, RosterCsvColumn> = {
  name: 'name', jersey: 'jersey', positions: 'positions', classYear: 'class', redshirt: 'redshirt',
  heightIn: 'height', weightLb: 'weight', status: 'status',
};

export interface RosterCsvResult {
  rows: PlayerInput[];
  errors: RosterImportRowError[];
}

/** Checks the header: every required column present, no unknown column. Row 1 is the header. */
export function checkRosterHeader(header: string[]): RosterImportRowError[] {
  const names = header.map((h) => h.trim().toLowerCase());
  const errors: RosterImportRowError[] = [];
  for (const required of ['name', 'jersey', 'positions', 'class'] as const) {
    if (!names.includes(required)) errors.push({ row: 1, field: required, message: `The header has no "${required}" column.` });
  }
  for (const name of names) {
    if (!(ROSTER_CSV_COLUMNS as readonly string[]).includes(name)) {
      errors.push({ row: 1, field: name, message: `Unknown column "${name}". Columns are ${ROSTER_CSV_COLUMNS.join(', ')}.` });
    }
  }
  return errors;
}

/**
 * Validates parsed CSV records (header already mapped to lower-case column names).
 * Row numbers count the header as row 1, as a spreadsheet shows them. Jerseys must be unique in the file.
 */
export function validateRosterRecords(records: RosterCsvRecord[]): RosterCsvResult {
  const rows: PlayerInput[] = [];
  const errors: RosterImportRowError[] = [];
  const jerseyRows = new Map<number, number>();
  const nameRows = new Map<string, number>();
  records.forEach((record, index) => {
    const row = index + 2;
    const rowErrors: RosterImportRowError[] = [];
    const redshirtText = (record.redshirt ?? '').trim().toLowerCase();
    if (!YES.has(redshirtText) && !NO.has(redshirtText)) {
      rowErrors.push({ row, field: 'redshirt', message: 'Redshirt is yes or no.' });
    }
    const heightText = (record.height ?? '').trim();
    const heightIn = heightText === '' ? null : parseHeight(heightText);
    if (heightText !== '' && heightIn === null) rowErrors.push({ row, field: 'height', message: 'Height is like 6-4 or 76 (inches).' });
    const weightText = (record.weight ?? '').trim();
    const weightLb = weightText === '' ? null : Number(weightText);
    const positionsText = (record.positions ?? '').trim();
    const positions = positionsText === '' ? [] : positionsText.split(/[\s/;|]+/).map((p) => p.toUpperCase());
    const candidate = {
      name: restoreCell(record.name ?? ''),
      jersey: (record.jersey ?? '').trim() === '' ? undefined : record.jersey?.trim(),
      positions,
      classYear: normaliseClass(record.class ?? ''),
      redshirt: YES.has(redshirtText),
      heightIn,
      weightLb,
      status: (record.status ?? '').trim().toLowerCase() || 'active',
    };
    const parsed = playerInputSchema.safeParse(candidate);
    if (!parsed.success) {
      const seen = new Set<string>();
      for (const issue of parsed.error.issues) {
        const field = FIELD_TO_COLUMN[String(issue.path[0])] ?? String(issue.path[0]);
        if (seen.has(field) || rowErrors.some((e) => e.field === field)) continue;
        seen.add(field);
        rowErrors.push({ row, field, message: columnMessage(field, issue.message) });
      }
    } else {
      const sameName = nameRows.get(parsed.data.name.toLowerCase());
      if (sameName !== undefined) rowErrors.push({ row, field: 'name', message: `${parsed.data.name} is also on row ${sameName}.` });
      else nameRows.set(parsed.data.name.toLowerCase(), row);
      const earlier = jerseyRows.get(parsed.data.jersey);
      if (earlier !== undefined) {
        rowErrors.push({ row, field: 'jersey', message: `Jersey ${parsed.data.jersey} is also on row ${earlier}.` });
      } else {
        jerseyRows.set(parsed.data.jersey, row);
      }
    }
    if (rowErrors.length > 0) errors.push(...rowErrors);
    else if (parsed.success) rows.push(parsed.data);
  });
  return { rows, errors };
}

/** Accepts the code (Jr) or the word (Junior, junior), as coaches type both. */
function normaliseClass(text: string): string {
  const t = text.trim().toLowerCase().replace(/\.$/, '');
  const match = CLASS_YEARS.find((c) => c.toLowerCase() === t || CLASS_YEAR_LABELS[c].toLowerCase() === t);
  return match ?? text.trim();
}

function columnMessage(column: string, message: string): string {
  if (column === 'positions' && message.startsWith('Invalid')) return `Positions are ${POSITIONS.join(', ')}.`;
  if (column === 'status' && message.startsWith('Invalid')) return `Status is one of ${PLAYER_STATUSES.join(', ')}.`;
  if (column === 'jersey' && /expected number|received undefined|NaN/i.test(message)) return 'Jersey must be a number.';
  if (column === 'weight' && /expected number|NaN/i.test(message)) return 'Weight is a number of pounds.';
  return message;
}

/** One CSV record per player, in our column order, for export (round-trips through import). */
export function rosterRecord(player: Player): Record<RosterCsvColumn, string> {
  return {
    name: defuseCell(player.name),
    jersey: String(player.jersey),
    positions: player.positions.join(' '),
    class: player.classYear,
    redshirt: player.redshirt ? 'yes' : 'no',
    height: formatHeight(player.heightIn),
    weight: player.weightLb == null ? '' : String(player.weightLb),
    status: player.status,
  };
}
