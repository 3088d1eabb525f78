import { sql } from 'kysely';
import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import type { Player, PlayerInput, PlayerUpdate, RosterImportRowError } from '@shared/api/roster';
import type { ClassYear, PlayerStatus, Position } from '@shared/roster';
import { checkRosterHeader, rosterRecord, ROSTER_CSV_COLUMNS, validateRosterRecords, type RosterCsvRecord } from '@shared/roster-csv';
import type { Database } from '../../db/database';
import type { AppContext } from '../core/context';
import { conflict, notFound, validationFailed } from '../core/errors';
import { isUniqueViolation } from '../core/pg-errors';
import { resolveSeason } from '../teams/teams.service';
import { findRosterRow, listRosterRows, type RosterRow } from './roster.repository';

const JERSEY_CONSTRAINT = 'roster_entries_season_jersey_unique';

function toPlayer(row: RosterRow): Player {
  return {
    id: row.id,
    name: row.name,
    jersey: row.jersey,
    positions: row.positions as Position[],
    classYear: row.class_year as ClassYear,
    redshirt: row.redshirt,
    heightIn: row.height_in,
    weightLb: row.weight_lb,
    status: row.status as PlayerStatus,
    seasonId: row.season_id,
    accountEmail: row.account_email,
  };
}

export async function listPlayers(app: AppContext, teamId: number, seasonId?: number): Promise<{ players: Player[]; seasonId: number }> {
  const season = await resolveSeason(app, teamId, seasonId);
  return { players: (await listRosterRows(app.db, teamId, season.id)).map(toPlayer), seasonId: season.id };
}

function jerseyTaken(jersey: number): never {
  throw conflict(`Jersey ${jersey} is already on this season's roster.`, { jersey: `Number ${jersey} is taken.` });
}

function entryValues(input: PlayerInput) {
  return {
    jersey: input.jersey,
    positions: input.positions,
    class_year: input.classYear,
    redshirt: input.redshirt,
    height_in: input.heightIn,
    weight_lb: input.weightLb,
    status: input.status,
  };
}

async function insertPlayer(db: Database, teamId: number, seasonId: number, input: PlayerInput): Promise<number> {
  const player = await db.insertInto('players').values({ team_id: teamId, name: input.name }).returning('id').executeTakeFirstOrThrow();
  await db.insertInto('roster_entries').values({ season_id: seasonId, player_id: player.id, ...entryValues(input) }).execute();
  return player.id;
}

export async function addPlayer(app: AppContext, teamId: number, input: PlayerInput & { seasonId?: number }): Promise<Player> {
  const season = await resolveSeason(app, teamId, input.seasonId);
  try {
    const id = await app.db.transaction().execute((trx) => insertPlayer(trx, teamId, season.id, input));
    return toPlayer((await findRosterRow(app.db, teamId, season.id, id))!);
  } catch (error) {
    if (isUniqueViolation(error, JERSEY_CONSTRAINT)) jerseyTaken(input.jersey);
    throw error;
  }
}

/** Edits a player's roster entry in a season (default: current). Deactivating is `status: inactive`. */
export async function updatePlayer(app: AppContext, teamId: number, playerId: number, change: PlayerUpdate, seasonId?: number): Promise<Player> {
  const season = await resolveSeason(app, teamId, seasonId);
  const existing = await findRosterRow(app.db, teamId, season.id, playerId);
  if (!existing) throw notFound('That player');
  try {
    await app.db.transaction().execute(async (trx) => {
      if (change.name !== undefined) await trx.updateTable('players').set({ name: change.name }).where('id', '=', playerId).execute();
      const values = {
        ...(change.jersey !== undefined ? { jersey: change.jersey } : {}),
        ...(change.positions !== undefined ? { positions: change.positions } : {}),
        ...(change.classYear !== undefined ? { class_year: change.classYear } : {}),
        ...(change.redshirt !== undefined ? { redshirt: change.redshirt } : {}),
        ...(change.heightIn !== undefined ? { height_in: change.heightIn } : {}),
        ...(change.weightLb !== undefined ? { weight_lb: change.weightLb } : {}),
        ...(change.status !== undefined ? { status: change.status } : {}),
      };
      if (Object.keys(values).length > 0) {
        await trx
          .updateTable('roster_entries')
          .set({ ...values, updated_at: app.now() })
          .where('player_id', '=', playerId)
          .where('season_id', '=', season.id)
          .execute();
      }
    });
  } catch (error) {
    if (isUniqueViolation(error, JERSEY_CONSTRAINT)) jerseyTaken(change.jersey!);
    throw error;
  }
  return toPlayer((await findRosterRow(app.db, teamId, season.id, playerId))!);
}

function parseCsv(csv: string): { header: string[]; records: RosterCsvRecord[] } | RosterImportRowError {
  try {
    const rows = parse(csv, { bom: true, skip_empty_lines: true, trim: true, relax_column_count: false }) as string[][];
    if (rows.length === 0) return { row: 1, field: 'file', message: 'The file is empty.' };
    const [header, ...body] = rows;
    const names = header!.map((h) => h.trim().toLowerCase());
    return {
      header: names,
      records: body.map((cells) => Object.fromEntries(names.map((n, i) => [n, cells[i] ?? ''])) as RosterCsvRecord),
    };
  } catch (error) {
    const line = (error as { lines?: number }).lines;
    return { row: line ?? 1, field: 'file', message: `The file is not valid CSV: ${(error as Error).message.split(':')[0]}.` };
  }
}

function rejectImport(errors: RosterImportRowError[]): never {
  throw validationFailed(`Nothing was imported: ${errors.length} problem${errors.length === 1 ? '' : 's'} found. Fix the rows and import again.`, undefined, { rows: errors });
}

/**
 * Imports a roster file into a season, all or nothing: every row is checked first and any bad row
 * (reported by row number and column) stops the whole import. A row whose name matches a player on
 * the season's roster updates that entry; other rows add players.
 */
export async function importRoster(app: AppContext, teamId: number, csv: string, seasonId?: number): Promise<{ imported: number; updated: number }> {
  const season = await resolveSeason(app, teamId, seasonId);
  const parsed = parseCsv(csv);
  if ('row' in parsed) rejectImport([parsed]);
  const headerErrors = checkRosterHeader(parsed.header);
  if (headerErrors.length > 0) rejectImport(headerErrors);
  if (parsed.records.length === 0) rejectImport([{ row: 2, field: 'file', message: 'The file has a header but no players.' }]);
  const { rows, errors } = validateRosterRecords(parsed.records);
  if (errors.length > 0) rejectImport(errors);

  const CSV_TO_ENTRY: Record<string, string> = { jersey: 'jersey', positions: 'positions', class: 'class_year', redshirt: 'redshirt', height: 'height_in', weight: 'weight_lb', status: 'status' };
  const presentColumns = new Set(parsed.header.map((h) => CSV_TO_ENTRY[h]).filter((c): c is string => Boolean(c)));
  const existing = await listRosterRows(app.db, teamId, season.id);
  const byName = new Map(existing.map((r) => [r.name.trim().toLowerCase(), r]));
  const byJersey = new Map(existing.map((r) => [r.jersey, r]));
  const matched = rows.map((row) => ({ row, match: byName.get(row.name.trim().toLowerCase()) }));
  const matchedIds = new Set(matched.flatMap((m) => (m.match ? [m.match.id] : [])));
  // A number held by a player the file does not mention stays his: that row cannot take it.
  const conflicts: RosterImportRowError[] = matched.flatMap(({ row, match }, i) => {
    const holder = byJersey.get(row.jersey);
    return holder && holder.id !== match?.id && !matchedIds.has(holder.id)
      ? [{ row: i + 2, field: 'jersey', message: `Jersey ${row.jersey} belongs to ${holder.name} on this season's roster.` }]
      : [];
  });
  if (conflicts.length > 0) rejectImport(conflicts);

  try {
    return await app.db.transaction().execute(async (trx) => {
      let imported = 0;
      let updated = 0;
      // Jerseys may swap between players in one file: check uniqueness at commit, not per row.
      await sql`SET CONSTRAINTS roster_entries_season_jersey_unique DEFERRED`.execute(trx);
      for (const { row, match } of matched) {
        if (match) {
          await trx.updateTable('players').set({ name: row.name }).where('id', '=', match.id).execute();
          // A column the file leaves out keeps what the roster already knows.
          const values = Object.fromEntries(Object.entries(entryValues(row)).filter(([column]) => presentColumns.has(column)));
          await trx.updateTable('roster_entries').set({ ...values, updated_at: app.now() }).where('player_id', '=', match.id).where('season_id', '=', season.id).execute();
          updated += 1;
        } else {
          await insertPlayer(trx, teamId, season.id, row);
          imported += 1;
        }
      }
      return { imported, updated };
    });
  } catch (error) {
    if (isUniqueViolation(error, JERSEY_CONSTRAINT)) rejectImport([{ row: 0, field: 'jersey', message: 'Two players would wear the same jersey.' }]);
    throw error;
  }
}

export async function exportRoster(app: AppContext, teamId: number, seasonId?: number): Promise<{ filename: string; csv: string }> {
  const season = await resolveSeason(app, teamId, seasonId);
  const players = (await listRosterRows(app.db, teamId, season.id)).map(toPlayer);
  const csv = stringify(players.map(rosterRecord), { header: true, columns: [...ROSTER_CSV_COLUMNS] });
  const safeName = season.name.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '') || 'season';
  return { filename: `roster-${safeName}.csv`, csv };
}
