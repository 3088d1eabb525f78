/** Guards shared by the stats helpers: counts are whole, non-negative numbers of snaps. */
export function assertCount(value: number, name: string): void {
  if (!Number.isInteger(value) || value < 0) throw new RangeError(`${name} must be a whole number ≥ 0 (got ${value})`);
}

export interface PlusMinus {
  plus: number;
  minus: number;
}
