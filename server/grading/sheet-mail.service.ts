import type { AppContext } from '../core/context';
import { conflict, notFound } from '../core/errors';
import type { TeamMembership } from '../core/route';
import { enqueueMail } from '../mail/outbox';
import { gradeSheetMail } from '../mail/templates';
import { buildGradeSheet } from './grade-sheet.service';

/** The player's own read-only Grade Sheet of the session (client route /study/sheets/:sessionId). */
const playerSheetLink = (app: AppContext, sessionId: number) => `${app.config.publicUrl}/study/sheets/${sessionId}`;

const pct = (rate: number | null) => (rate === null ? '—' : `${Math.round(rate * 100)} %`);

/** Mails one player his own numbers for a session (through the queue; the SMTP fake locally). */
export async function mailGradeSheet(app: AppContext, sessionId: number, playerId: number, viewer: TeamMembership): Promise<void> {
  const sheet = await buildGradeSheet(app, sessionId, viewer);
  const row = sheet.players.find((p) => p.playerId === playerId);
  if (!row) throw notFound('Grades of that player in this session');
  const account = await app.db
    .selectFrom('memberships')
    .innerJoin('users', 'users.id', 'memberships.user_id')
    .select(['users.email'])
    .where('memberships.player_id', '=', playerId)
    .where('memberships.active', '=', true)
    .executeTakeFirst();
  if (!account) throw conflict(`${row.name} has no Trenchwork account yet: invite him from the staff page first.`);
  const session = await app.db.selectFrom('film_sessions').select(['title']).where('id', '=', sessionId).executeTakeFirstOrThrow();
  const lines = [
    `Snaps graded: ${row.snaps}. Plus: ${row.plus} (${pct(row.plusRate)}; the winning grade is ${Math.round(sheet.winningThreshold * 100)} %: ${row.meetsWinningGrade ? 'met' : 'not met yet'}).`,
    `Assignment ${pct(row.components.assignment?.rate ?? null)} · footwork ${pct(row.components.footwork?.rate ?? null)} · hands ${pct(row.components.hands?.rate ?? null)} · pad level ${pct(row.components.padLevel?.rate ?? null)} · effort ${pct(row.components.effort?.rate ?? null)}.`,
    `Missed assignments ${row.missedAssignments}, knockdowns ${row.knockdowns}, pressures allowed ${row.pressuresAllowed}, sacks allowed ${row.sacksAllowed}, penalties ${row.penalties}.`,
    ...row.notes.slice(0, 10).map((n) => `Snap ${n.snapOrder}: ${n.note}`),
  ];
  await enqueueMail(app, gradeSheetMail({ to: account.email, playerName: row.name, sessionTitle: session.title, lines, link: playerSheetLink(app, sessionId) }));
}
