import { createDatabase, type Database } from '../database';
import { hashPassword } from '../../server/core/password-hashing';
import { DEMO_CHART_CHANGES, DEMO_DEPTH_CHART, DEMO_LATE_SEASON_RG, DEMO_PLAYER, DEMO_ROSTER, DEMO_STAFF, DEMO_TEAM_NAME } from './demo-roster';
import { generateSeasonFilm, setDepthChart, setWeekChart } from './film-and-grades';
import { seedDemoFilm } from './demo-film';
import { loadConfig } from '../../server/core/config';

/**
 * Seeds the invented demo program when the database has no team yet (`npm run seed`). Demo accounts
 * exist only here. Password: DEMO_PASSWORD or trenchwork-demo; in production (a demo server, compose
 * --profile demo) only with DEMO_PASSWORD set, so the README's public password never reaches a server.
 */
export async function seedDemo(db: Database, password: string): Promise<boolean> {
  const existing = await db.selectFrom('teams').select('id').limit(1).executeTakeFirst();
  if (existing) return false;
  const passwordHash = await hashPassword(password);
  await db.transaction().execute(async (trx) => {
    const team = await trx.insertInto('teams').values({ name: DEMO_TEAM_NAME }).returning('id').executeTakeFirstOrThrow();
    await trx
      .insertInto('seasons')
      .values({ team_id: team.id, name: '2025', starts_on: '2025-08-01', ends_on: '2025-12-15', is_current: false })
      .execute();
    const season = await trx
      .insertInto('seasons')
      .values({ team_id: team.id, name: '2026', starts_on: '2026-08-01', ends_on: '2026-12-15', is_current: true })
      .returning('id')
      .executeTakeFirstOrThrow();
    const playerIdByJersey = new Map<number, number>();
    for (const entry of DEMO_ROSTER) {
      const player = await trx.insertInto('players').values({ team_id: team.id, name: entry.name }).returning('id').executeTakeFirstOrThrow();
      playerIdByJersey.set(entry.jersey, player.id);
      await trx
        .insertInto('roster_entries')
        .values({
          season_id: season.id,
          player_id: player.id,
          jersey: entry.jersey,
          positions: entry.positions,
          class_year: entry.classYear,
          redshirt: entry.redshirt ?? false,
          height_in: entry.heightIn,
          weight_lb: entry.weightLb,
          status: entry.status ?? 'active',
        })
        .execute();
    }
    const accounts = [
      ...DEMO_STAFF.map((s) => ({ ...s, playerId: null as number | null })),
      {
        email: DEMO_PLAYER.email,
        name: DEMO_ROSTER.find((r) => r.jersey === DEMO_PLAYER.jersey)!.name,
        role: 'player',
        playerId: playerIdByJersey.get(DEMO_PLAYER.jersey)!,
      },
    ];
    for (const account of accounts) {
      const user = await trx
        .insertInto('users')
        .values({ email: account.email, name: account.name, password_hash: passwordHash, password_changed_at: new Date() })
        .returning('id')
        .executeTakeFirstOrThrow();
      await trx.insertInto('memberships').values({ user_id: user.id, team_id: team.id, role: account.role, player_id: account.playerId }).execute();
    }
    const byJersey = (order: Record<string, number[]>) => Object.fromEntries(Object.entries(order).map(([position, jerseys]) => [position, jerseys.map((j) => playerIdByJersey.get(j)!)]));
    await setDepthChart(trx, season.id, byJersey(DEMO_DEPTH_CHART));
    const userId = async (email: string) => (await trx.selectFrom('users').select('id').where('email', '=', email).executeTakeFirstOrThrow()).id;
    // The coordinator's mid-season changes, in the history like any other (the film below follows them).
    for (const change of DEMO_CHART_CHANGES) {
      await setWeekChart(trx, season.id, change.week, byJersey(change.positions), { userId: await userId('coordinator@trenchwork.test'), reason: change.reason });
    }
    // Six graded weeks of the 2026 season so far: games on Fridays from 4 September, two practices a week.
    await generateSeasonFilm(trx, {
      teamId: team.id,
      seasonId: season.id,
      seasonStart: '2026-09-04',
      weeks: 6,
      practicesPerWeek: 2,
      snapsPerGame: [55, 68],
      repsPerPractice: 36,
      coachId: await userId('coach@trenchwork.test'),
      coordinatorId: await userId('coordinator@trenchwork.test'),
      coordinatorShare: 0.4,
      seed: 2026,
    });
  });
  return true;
}

async function main(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set.');
  if (process.env.NODE_ENV === 'production' && !process.env.DEMO_PASSWORD) {
    throw new Error('In production the demo seed runs only with DEMO_PASSWORD set (the README\'s public password must not reach a server).');
  }
  const handle = createDatabase(url, { max: 2 });
  try {
    const seeded = await seedDemo(handle.db, process.env.DEMO_PASSWORD || 'trenchwork-demo');
    console.log(seeded ? `Seeded the demo program "${DEMO_TEAM_NAME}".` : 'Demo data already present; left as it is.');
    if (seeded) {
      const db = handle.db;
      const team = await db.selectFrom('teams').select('id').where('name', '=', DEMO_TEAM_NAME).executeTakeFirstOrThrow();
      const coach = await db.selectFrom('users').select('id').where('email', '=', 'coach@trenchwork.test').executeTakeFirstOrThrow();
      const player = await db.selectFrom('memberships').select('player_id').where('team_id', '=', team.id).where('role', '=', 'player').executeTakeFirstOrThrow();
      const other = await db
        .selectFrom('roster_entries')
        .innerJoin('players', 'players.id', 'roster_entries.player_id')
        .select('players.id')
        .where('players.team_id', '=', team.id)
        .where('roster_entries.jersey', '=', DEMO_LATE_SEASON_RG)
        .executeTakeFirstOrThrow();
      console.log(`Demo film: ${await seedDemoFilm(db, loadConfig(), team.id, coach.id, { player: player.player_id!, other: other.id })}.`);
    }
  } finally {
    await handle.close();
  }
}

if (require.main === module) {
  main().catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
}
