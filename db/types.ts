import type { ColumnType, Generated } from 'kysely';

// Kysely table types. pg returns bigint as string; db/database.ts parses int8 to number
// (ids stay far below 2^53), so ids are typed as numbers here.
type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;
type RequiredTimestamp = ColumnType<Date, Date | string, Date | string>;
type NullableTimestamp = ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
/** DATE columns come back as 'YYYY-MM-DD' strings (type parser set in db/database.ts). */
type DateString = ColumnType<string, string, string>;

export interface UsersTable {
  id: Generated<number>;
  email: string;
  name: string;
  password_hash: string | null;
  active: Generated<boolean>;
  password_changed_at: NullableTimestamp;
  created_at: Timestamp;
}

export interface TeamsTable {
  id: Generated<number>;
  name: string;
  created_at: Timestamp;
}

export interface SeasonsTable {
  id: Generated<number>;
  team_id: number;
  name: string;
  starts_on: DateString;
  ends_on: DateString;
  is_current: Generated<boolean>;
  created_at: Timestamp;
}

export interface PlayersTable {
  id: Generated<number>;
  team_id: number;
  name: string;
  created_at: Timestamp;
}

export interface RosterEntriesTable {
  id: Generated<number>;
  season_id: number;
  player_id: number;
  jersey: number;
  positions: string[];
  class_year: string;
  redshirt: Generated<boolean>;
  height_in: number | null;
  weight_lb: number | null;
  status: Generated<string>;
  updated_at: Timestamp;
}

export interface MembershipsTable {
  id: Generated<number>;
  user_id: number;
  team_id: number;
  role: string;
  player_id: number | null;
  active: Generated<boolean>;
  created_at: Timestamp;
}

export interface InvitationsTable {
  id: Generated<number>;
  team_id: number;
  email: string;
  role: string;
  player_id: number | null;
  token_hash: string;
  invited_by: number;
  expires_at: RequiredTimestamp;
  last_sent_at: Timestamp;
  accepted_at: NullableTimestamp;
  revoked_at: NullableTimestamp;
  created_at: Timestamp;
}

export interface PasswordResetsTable {
  id: Generated<number>;
  user_id: number;
  token_hash: string;
  expires_at: RequiredTimestamp;
  used_at: NullableTimestamp;
  created_at: Timestamp;
}

export interface SessionTable {
  sid: string;
  sess: unknown;
  expire: Timestamp;
}

export interface DB {
  users: UsersTable;
  teams: TeamsTable;
  seasons: SeasonsTable;
  players: PlayersTable;
  roster_entries: RosterEntriesTable;
  memberships: MembershipsTable;
  invitations: InvitationsTable;
  password_resets: PasswordResetsTable;
  session: SessionTable;
}
