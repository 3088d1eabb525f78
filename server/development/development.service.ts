import { rateWithInterval, rollingPlusRate, tallyBySession, tallyByWeek, weeklyTrend, type RateWithInterval } from '@shared/stats';
import type { AppContext } from '../core/context';
import { forbidden, notFound } from '../core/errors';
import type { TeamMembership } from '../core/route';
import { currentScheme } from '../grading/scheme.service';
import { resolveSeason } from '../teams/teams.service';
import { componentBySession, componentTallies, sessionTallies, splitTallies, SPLITS } from './development.repository';
import { listGoals, listNotes } from './goals.service';

/** Splits with fewer graded snaps than this are listed but not called strongest or weakest. */
export const MIN_SPLIT_SNAPS = 10;
export const ROLLING_WINDOW = 3;

const shape = (r: RateWithInterval) => ({ snaps: r.snaps, plus: r.plus, rate: r.rate, interval: r.interval });

export async function playerTeam(app: AppContext, params: { id: number }): Promise<number | null> {
  return (await app.db.selectFrom('players').select('team_id').where('id', '=', params.id).executeTakeFirst())?.team_id ?? null;
}

/** A player reads only his own development page. */
export function assertOwnPlayer(membership: TeamMembership, playerId: number): void {
  if (membership.role === 'player' && membership.playerId !== playerId) throw forbidden('A player sees only his own development page.');
}

/**
 * A player's development over a season from the final grades: per session with Wilson intervals and
 * a rolling rate, overall and per component, the weekly least-squares trend with its reading
 * (shared/stats TREND_RULE), splits by concept, front, personnel, down and distance, hash, quarter,
 * game vs practice and position, the strongest and weakest concepts and fronts, goals and notes.
 */
export async function playerDevelopment(app: AppContext, playerId: number, seasonId?: number) {
  const player = await app.db.selectFrom('players').select(['id', 'name', 'team_id']).where('id', '=', playerId).executeTakeFirst();
  if (!player) throw notFound('That player');
  const season = await resolveSeason(app, player.team_id, seasonId);
  const [sessions, components, bySession, splits, scheme, goals, notes] = await Promise.all([
    sessionTallies(app.db, playerId, season.id),
    componentTallies(app.db, playerId, season.id),
    componentBySession(app.db, playerId, season.id),
    splitTallies(app.db, playerId, season.id),
    currentScheme(app.db, player.team_id),
    listGoals(app, playerId),
    listNotes(app, playerId),
  ]);
  const tallied = tallyBySession(sessions.map((s) => ({ ...s, date: s.date })));
  const rolling = rollingPlusRate(tallied, ROLLING_WINDOW);
  const weeks = tallyByWeek(tallied);
  const trend = weeklyTrend(weeks);
  const total = tallied.reduce((acc, s) => ({ plus: acc.plus + s.plus, minus: acc.minus + s.minus }), { plus: 0, minus: 0 });
  const componentNames = ['assignment', 'footwork', 'hands', 'padLevel', 'effort'] as const;
  const columnOf: Record<(typeof componentNames)[number], string> = { assignment: 'assignment', footwork: 'footwork', hands: 'hands', padLevel: 'pad_level', effort: 'effort' };
  const componentSummary = Object.fromEntries(
    componentNames.map((c) => [c, shape(rateWithInterval(Number(components[`${columnOf[c]}_plus`] ?? 0), Number(components[`${columnOf[c]}_minus`] ?? 0)))]),
  );
  const componentTrends = Object.fromEntries(
    componentNames.map((c) => {
      const rows = tallied.map((s) => {
        const row = bySession.find((b) => b.session_id === s.session_id && b.component === c);
        return { sessionId: s.session_id, date: s.date, ...shape(rateWithInterval(row?.plus ?? 0, row?.minus ?? 0)) };
      });
      return [c, { sessions: rows, rolling: rollingPlusRate(rows.map((r) => ({ plus: r.plus, minus: r.snaps - r.plus })), ROLLING_WINDOW) }];
    }),
  );
  const splitGroups = Object.fromEntries(
    SPLITS.map((name) => [
      name,
      splits
        .filter((s) => s.split === name)
        .map((s) => ({ value: s.value ?? 'untagged', ...shape(rateWithInterval(s.plus, s.minus)) }))
        .sort((a, b) => b.snaps - a.snaps),
    ]),
  );
  const ranked = (name: 'concept' | 'front') => {
    const enough = (splitGroups[name] as { value: string; snaps: number; rate: number | null }[]).filter((s) => s.snaps >= MIN_SPLIT_SNAPS && s.value !== 'untagged');
    const byRate = [...enough].sort((a, b) => (b.rate ?? 0) - (a.rate ?? 0));
    return { strongest: byRate.slice(0, 3), weakest: byRate.slice(-3).reverse() };
  };
  return {
    playerId,
    name: player.name,
    seasonId: season.id,
    winningThreshold: scheme.rules.winningThreshold,
    sessions: tallied.map((s, i) => ({ sessionId: s.session_id, date: s.date, kind: s.kind, title: s.title, snaps: s.snaps, plus: s.plus, rate: s.rate, interval: s.interval, rolling: rolling[i] ?? null })),
    overall: shape(rateWithInterval(total.plus, total.minus)),
    components: componentSummary,
    componentTrends,
    weeks: weeks.map((w) => ({ weekStart: w.weekStart, ...shape(w) })),
    trend: { slopePerWeek: trend.slope, slopeInterval: trend.slopeInterval, weeks: trend.weeks, reading: trend.reading },
    splits: splitGroups,
    concepts: ranked('concept'),
    fronts: ranked('front'),
    goals: goals.map((g) => {
      const current = componentSummary[g.component as keyof typeof componentSummary] ?? (g.component === 'overall' ? shape(rateWithInterval(total.plus, total.minus)) : null);
      return { ...g, current: current?.rate ?? null, met: current?.rate != null && current.rate >= g.target };
    }),
    notes,
  };
}
