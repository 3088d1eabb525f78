/**
 * Spreadsheet programs run a cell that starts with =, +, -, @, tab or carriage return as a formula
 * (OWASP "CSV Injection"). Exports prefix such text with an apostrophe; imports take it off again.
 * Plain numbers (e.g. a gain of -3) are left as they are.
 */
const FORMULA_START = /^[=+\-@\t\r]/;

export function defuseCell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  const text = String(value);
  if (typeof value === 'number' || /^-?\d+(\.\d+)?$/.test(text)) return text;
  return FORMULA_START.test(text) ? `'${text}` : text;
}

export function restoreCell(text: string): string {
  return text.length > 1 && text.startsWith("'") && FORMULA_START.test(text.slice(1)) ? text.slice(1) : text;
}
