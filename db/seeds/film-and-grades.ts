import { DEFAULT_TAG_LISTS } from '@shared/film';
import { chartWeekInForce } from '@shared/depth-chart';
import { snapResult, type GradeMarks, type Mark } from '@shared/grading';
import { chartRows, copyChartWeek, insertChartChange, replacePositions, savedChartWeeks } from '../../server/grading/depth-chart.repository';
import type { Database } from '../database';

/**
 * Invented film sessions, play data and grades for a season: games against invented opponents with
 * 50–70 snaps, practices with named periods, the depth chart's starters on the field (with a few
 * substitutions), grades by the position coach on every snap and by the coordinator on some (so
 * calibration has something to compare). Each lineman has a skill level per component that rises
 * or falls a little week by week, so trends have something true-looking to show. Deterministic:
 * the same seed gives the same data. Used by the demo seed and by the benchmarks' generator.
 */
export interface GradeGenerationOptions {
  teamId: number;
  seasonId: number;
  seasonStart: string; // YYYY-MM-DD, the first game's week
  weeks: number;
  practicesPerWeek: number;
  snapsPerGame: [number, number];
  repsPerPractice: number;
  coachId: number;
  coordinatorId: number;
  /** Share of game snaps the coordinator also grades (0–1). */
  coordinatorShare: number;
  seed: number;
  opponents?: string[];
}

const INVENTED_OPPONENTS = ['Hollow Creek', 'Marrow Flats', 'Quarry Point', 'Stonebridge', 'Saltmarsh', 'Cinder Valley', 'Ashford Ridge', 'Pell Harbor', 'Wrenfield', 'Granite Fork', 'Otter Bend', 'Kestrel Lake'];
const PERIODS = ['inside run', 'one-on-one pass protection', 'team run', 'team pass', 'goal line'];
const PERSONNEL = ['11', '11', '11', '12', '12', '21', '10', '13'];

/** A small seeded PRNG (mulberry32): fast, and the same numbers on every machine. */
export function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function addDays(date: string, days: number): string {
  const d = new Date(`${date}T12:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

async function tagIds(db: Database, teamId: number) {
  const existing = await db.selectFrom('tag_list_items').select(['id', 'kind', 'name']).where('team_id', '=', teamId).execute();
  if (existing.length === 0) {
    const rows = Object.entries(DEFAULT_TAG_LISTS).flatMap(([kind, names]) => names.map((name, i) => ({ team_id: teamId, kind, name, sort_order: i })));
    await db.insertInto('tag_list_items').values(rows).execute();
  }
  const all = await db.selectFrom('tag_list_items').select(['id', 'kind', 'name']).where('team_id', '=', teamId).execute();
  const of = (kind: string) => all.filter((r) => r.kind === kind);
  return { concepts: of('concept'), fronts: of('front'), formations: of('formation'), outcomes: of('outcome') };
}

interface Lineman {
  playerId: number;
  position: string;
  /** Base probability of a plus per component, and its change per week. */
  skill: Record<'assignment' | 'footwork' | 'hands' | 'padLevel' | 'effort', number>;
  drift: number;
}

export async function generateSeasonFilm(db: Database, o: GradeGenerationOptions): Promise<{ sessions: number; snaps: number; grades: number }> {
  const rand = prng(o.seed);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(rand() * list.length)]!;
  const tags = await tagIds(db, o.teamId);
  const chart = await db.selectFrom('depth_chart_entries').select(['week', 'position', 'rank', 'player_id']).where('season_id', '=', o.seasonId).orderBy('week').orderBy('rank').execute();
  const savedWeeks = [...new Set(chart.map((c) => c.week))];
  // Each week's film follows the chart in force that week (a mid-season change shows on the field).
  const lineupAt = (week: number) => {
    const inForce = chart.filter((c) => c.week === chartWeekInForce(savedWeeks, week));
    const starters = ['LT', 'LG', 'C', 'RG', 'RT'].map((position) => inForce.find((c) => c.position === position && c.rank === 1)).filter((c): c is NonNullable<typeof c> => Boolean(c));
    return { starters, backups: inForce.filter((c) => c.rank === 2) };
  };
  const linemen = new Map<number, Lineman>();
  for (const c of savedWeeks.flatMap((w) => { const l = lineupAt(w); return [...l.starters, ...l.backups]; })) {
    if (linemen.has(c.player_id)) continue;
    // Under the strict rule a snap is plus only when the assignment and every part are plus, so each
    // part is plus far more often than the snap: about 0.93 per part gives a 70–85 % lineman.
    const base = 0.885 + rand() * 0.085;
    linemen.set(c.player_id, {
      playerId: c.player_id,
      position: c.position,
      skill: { assignment: Math.min(0.99, base + 0.05), footwork: base, hands: base - 0.02 + rand() * 0.04, padLevel: base - 0.04 + rand() * 0.05, effort: Math.min(0.995, base + 0.06) },
      drift: (rand() - 0.35) * 0.008,
    });
  }
  // Concept × front affinity: a line blocks best what it reps most; a few pairings are weak.
  const weakness = new Map<string, number>();
  for (const c of tags.concepts) for (const f of tags.fronts) weakness.set(`${c.id}:${f.id}`, rand() < 0.2 ? -0.08 : rand() * 0.03);

  let sessions = 0;
  let snapCount = 0;
  let gradeCount = 0;
  const gradeRows: Record<string, unknown>[] = [];
  const opponents = o.opponents ?? INVENTED_OPPONENTS;
  for (let week = 1; week <= o.weeks; week += 1) {
    const { starters, backups } = lineupAt(week);
    const gameDate = addDays(o.seasonStart, (week - 1) * 7);
    const plans = [
      { kind: 'game', date: gameDate, title: `Week ${week} vs ${opponents[(week - 1) % opponents.length]}`, opponent: opponents[(week - 1) % opponents.length]! },
      ...Array.from({ length: o.practicesPerWeek }, (_, i) => ({ kind: 'practice', date: addDays(gameDate, -4 + i * 2), title: `Week ${week} practice ${i + 1}`, opponent: null as string | null })),
    ];
    for (const plan of plans) {
      const session = await db
        .insertInto('film_sessions')
        .values({
          team_id: o.teamId,
          season_id: o.seasonId,
          kind: plan.kind,
          title: plan.title,
          date: plan.date,
          opponent: plan.opponent,
          home_away: plan.kind === 'game' ? (week % 2 ? 'home' : 'away') : null,
          week,
          periods: plan.kind === 'practice' ? PERIODS.slice(0, 4) : [],
          created_by: o.coachId,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      sessions += 1;
      const count = plan.kind === 'game' ? o.snapsPerGame[0] + Math.floor(rand() * (o.snapsPerGame[1] - o.snapsPerGame[0] + 1)) : o.repsPerPractice;
      const snapValues = Array.from({ length: count }, (_, i) => {
        const concept = pick(tags.concepts);
        const front = pick(tags.fronts);
        const down = 1 + Math.floor(rand() * 3.4);
        return {
          session_id: session.id,
          order: i + 1,
          quarter: plan.kind === 'game' ? 1 + Math.floor((i / count) * 4) : null,
          down,
          distance: down === 1 ? 10 : 1 + Math.floor(rand() * 12),
          yard_line: 1 + Math.floor(rand() * 50),
          field_side: rand() < 0.55 ? 'own' : 'opp',
          hash: pick(['left', 'middle', 'right'] as const),
          personnel: pick(PERSONNEL),
          formation_id: pick(tags.formations).id,
          concept_id: concept.id,
          direction: pick(['left', 'middle', 'right'] as const),
          front_id: front.id,
          result_yards: Math.round((rand() - 0.25) * 14),
          outcome_id: pick(tags.outcomes).id,
          period: plan.kind === 'practice' ? pick(PERIODS.slice(0, 4)) : null,
        };
      });
      const snaps = await db.insertInto('snaps').values(snapValues).returning(['id', 'concept_id', 'front_id']).execute();
      snapCount += snaps.length;
      for (const snap of snaps) {
        // Now and then a backup plays a snap for the starter at his spot.
        const onField = starters.map((s) => {
          const backup = backups.find((b) => b.position === s.position);
          return backup && rand() < 0.08 ? { player_id: backup.player_id, position: s.position } : { player_id: s.player_id, position: s.position };
        });
        if (onField.some((p, i) => p.player_id !== starters[i]!.player_id)) {
          await db.insertInto('snap_participants').values(onField.map((p) => ({ snap_id: snap.id, player_id: p.player_id, position: p.position }))).execute();
        }
        const graders = [o.coachId, ...(plan.kind === 'game' && rand() < o.coordinatorShare ? [o.coordinatorId] : [])];
        for (const p of onField) {
          const man = linemen.get(p.player_id)!;
          const bonus = (weakness.get(`${snap.concept_id}:${snap.front_id}`) ?? 0) + man.drift * week + (plan.kind === 'practice' ? 0.03 : 0);
          const base: GradeMarks = { assignment: 'right', footwork: null, hands: null, padLevel: null, effort: null, extra: {} };
          const roll = (p0: number): Mark => (rand() < Math.max(0.05, Math.min(0.99, p0 + bonus)) ? 'plus' : 'minus');
          const truth = {
            ...base,
            assignment: rand() < man.skill.assignment + bonus ? ('right' as const) : ('missed' as const),
            footwork: roll(man.skill.footwork),
            hands: roll(man.skill.hands),
            padLevel: roll(man.skill.padLevel),
            effort: rand() < 0.01 ? ('loaf' as const) : roll(man.skill.effort),
          };
          for (const [g, graderId] of graders.entries()) {
            // A second grader mostly agrees; sometimes he sees hands or pad level the other way.
            const marks = g === 0 ? truth : { ...truth, hands: rand() < 0.12 ? flip(truth.hands) : truth.hands, padLevel: rand() < 0.12 ? flip(truth.padLevel) : truth.padLevel };
            const penalties = rand() < 0.015 ? [{ type: pick(['holding', 'false start', 'illegal use of hands']) }] : [];
            gradeRows.push({
              snap_id: snap.id,
              player_id: p.player_id,
              grader_id: graderId,
              scheme_version: 1,
              position: p.position,
              assignment: marks.assignment,
              missed_reason: marks.assignment === 'missed' ? pick(['wrong gap or man', 'wrong call', 'communication', 'late off the ball']) : null,
              footwork: marks.footwork,
              hands: marks.hands,
              pad_level: marks.padLevel,
              extra: '{}',
              effort: marks.effort,
              knockdowns: rand() < 0.12 ? 1 : 0,
              pressures_allowed: rand() < 0.04 ? 1 : 0,
              sacks_allowed: rand() < 0.008 ? 1 : 0,
              penalties: JSON.stringify(penalties),
              penalty_count: penalties.length,
              result: snapResult(marks),
            });
          }
        }
      }
      if (gradeRows.length > 5000) gradeCount += await flush(db, gradeRows);
    }
  }
  gradeCount += await flush(db, gradeRows);
  return { sessions, snaps: snapCount, grades: gradeCount };
}

/** Inserts the collected grade rows in batches and empties the list; answers how many. */
async function flush(db: Database, rows: Record<string, unknown>[]): Promise<number> {
  for (let i = 0; i < rows.length; i += 2000) {
    await db.insertInto('grades').values(rows.slice(i, i + 2000) as never).execute();
  }
  const count = rows.length;
  rows.length = 0;
  return count;
}

function flip(mark: Mark | null): Mark | null {
  return mark === 'plus' ? 'minus' : mark === 'minus' ? 'plus' : null;
}

/**
 * Saves a week's chart as the API does: the chart carried into the week, with `positions` replaced,
 * and a history entry with who and why.
 */
export async function setWeekChart(db: Database, seasonId: number, week: number, positions: Record<string, number[]>, by: { userId: number; reason: string }): Promise<void> {
  const inForce = chartWeekInForce(await savedChartWeeks(db, seasonId), week);
  const before = inForce === null ? [] : await chartRows(db, seasonId, inForce);
  if (inForce !== null && inForce !== week) await copyChartWeek(db, seasonId, inForce, week);
  await replacePositions(db, seasonId, week, positions);
  const after = await chartRows(db, seasonId, week);
  const shape = (list: typeof before) => JSON.stringify(list.map((r) => ({ position: r.position, rank: r.rank, playerId: r.player_id })));
  await insertChartChange(db, { seasonId, week, userId: by.userId, reason: by.reason, before: shape(before), after: shape(after) });
}

/** Sets a season's base (week 0) depth chart from the roster: the first listed player at each spot starts. */
export async function setDepthChart(db: Database, seasonId: number, order: Record<string, number[]>): Promise<void> {
  const rows = Object.entries(order).flatMap(([position, ids]) => ids.map((player_id, i) => ({ season_id: seasonId, position, rank: i + 1, player_id })));
  await db.deleteFrom('depth_chart_entries').where('season_id', '=', seasonId).execute();
  if (rows.length > 0) await db.insertInto('depth_chart_entries').values(rows).execute();
}
