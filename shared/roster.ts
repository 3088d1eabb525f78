/** Roster vocabulary: positions a lineman can list, class years, statuses. */
export const POSITIONS = ['LT', 'LG', 'C', 'RG', 'RT', 'TE'] as const;
export type Position = (typeof POSITIONS)[number];

export const CLASS_YEARS = ['Fr', 'So', 'Jr', 'Sr', 'Gr'] as const;
export type ClassYear = (typeof CLASS_YEARS)[number];
export const CLASS_YEAR_LABELS: Record<ClassYear, string> = {
  Fr: 'Freshman',
  So: 'Sophomore',
  Jr: 'Junior',
  Sr: 'Senior',
  Gr: 'Graduate',
};

export const PLAYER_STATUSES = ['active', 'injured', 'inactive'] as const;
export type PlayerStatus = (typeof PLAYER_STATUSES)[number];

export const JERSEY_MIN = 0;
export const JERSEY_MAX = 99;

/** Height is stored in inches; shown as feet and inches (6-4). */
export function formatHeight(inches: number | null | undefined): string {
  if (inches == null) return '';
  return `${Math.floor(inches / 12)}-${inches % 12}`;
}

/** Parses "6-4", "6'4", "6'4\"" or a plain number of inches. Returns null when it cannot. */
export function parseHeight(text: string): number | null {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  const feetInches = /^(\d)\s*['\-\s]\s*(\d{1,2})\s*"?$/.exec(trimmed);
  if (feetInches) {
    const feet = Number(feetInches[1]);
    const inches = Number(feetInches[2]);
    return inches < 12 ? feet * 12 + inches : null;
  }
  return /^\d{2}$/.test(trimmed) ? Number(trimmed) : null;
}

/** Our roster file's columns, in order. The header row is required on import. */
export const ROSTER_CSV_COLUMNS = ['name', 'jersey', 'positions', 'class', 'redshirt', 'height', 'weight', 'status'] as const;
export type RosterCsvColumn = (typeof ROSTER_CSV_COLUMNS)[number];
