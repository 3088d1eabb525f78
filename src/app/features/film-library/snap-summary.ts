import type { Snap } from '@shared/api/film';

const DOWN_WORDS = ['', '1st', '2nd', '3rd', '4th'];
const SIDE_WORDS = { left: 'L', middle: 'M', right: 'R' } as const;

/** One line of play data for the snap list: "Q2 · 3rd & 4 · opp 35 · 11 · inside zone · +6". */
export function snapSummary(snap: Snap, tagName: (id: number) => string | undefined): string {
  const parts: string[] = [];
  if (snap.quarter !== null) parts.push(snap.quarter === 5 ? 'OT' : `Q${snap.quarter}`);
  if (snap.period) parts.push(snap.period);
  if (snap.down !== null) parts.push(snap.distance !== null ? `${DOWN_WORDS[snap.down]} & ${snap.distance}` : DOWN_WORDS[snap.down]);
  else if (snap.distance !== null) parts.push(`& ${snap.distance}`);
  if (snap.yardLine !== null) parts.push(snap.yardLine === 50 ? 'mid 50' : `${snap.fieldSide ?? ''} ${snap.yardLine}`.trim());
  if (snap.hash) parts.push(`${SIDE_WORDS[snap.hash]} hash`);
  if (snap.personnel) parts.push(snap.personnel);
  for (const id of [snap.formationId, snap.conceptId]) {
    const name = id === null ? undefined : tagName(id);
    if (name) parts.push(name);
  }
  if (snap.direction) parts.push(`to ${snap.direction}`);
  const front = snap.frontId === null ? undefined : tagName(snap.frontId);
  if (front) parts.push(`vs ${front}`);
  if (snap.resultYards !== null) parts.push(snap.resultYards > 0 ? `+${snap.resultYards}` : snap.resultYards < 0 ? `−${-snap.resultYards}` : '0');
  const outcome = snap.outcomeId === null ? undefined : tagName(snap.outcomeId);
  if (outcome) parts.push(outcome);
  return parts.join(' · ');
}
