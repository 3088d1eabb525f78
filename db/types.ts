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
  share_grades_with_players: Generated<boolean>;
  share_unit_with_players: Generated<boolean>;
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

export interface TagListItemsTable {
  id: Generated<number>;
  team_id: number;
  kind: string;
  name: string;
  active: Generated<boolean>;
  sort_order: Generated<number>;
}

export interface FilmSessionsTable {
  id: Generated<number>;
  team_id: number;
  season_id: number;
  kind: string;
  title: string;
  date: DateString;
  opponent: string | null;
  home_away: string | null;
  week: number | null;
  periods: ColumnType<string[], string[] | undefined, string[]>;
  grading_locked: Generated<boolean>;
  created_by: number | null;
  created_at: Timestamp;
}

export interface SnapsTable {
  id: Generated<number>;
  session_id: number;
  order: number;
  quarter: number | null;
  down: number | null;
  distance: number | null;
  yard_line: number | null;
  field_side: string | null;
  hash: string | null;
  personnel: string | null;
  formation_id: number | null;
  concept_id: number | null;
  direction: string | null;
  front_id: number | null;
  result_yards: number | null;
  outcome_id: number | null;
  period: string | null;
  notes: string | null;
  created_at: Timestamp;
  updated_at: Timestamp;
}

/** Strip (scrub preview sprite) layout, stored as JSON on the clip. */
export interface StripLayout {
  frames: number;
  intervalMs: number;
  tileWidth: number;
  tileHeight: number;
}

export interface ClipsTable {
  id: Generated<number>;
  team_id: number;
  session_id: number;
  snap_id: number | null;
  kind: Generated<string>;
  angle: Generated<string>;
  upload_order: number;
  original_name: string;
  status: Generated<string>;
  failure_reason: string | null;
  progress: Generated<number>;
  sha256: string | null;
  size_bytes: number | null;
  original_key: string | null;
  poster_key: string | null;
  strip_key: string | null;
  strip: ColumnType<StripLayout | null, string | null, string | null>;
  rendition_key: string | null;
  duration_ms: number | null;
  width: number | null;
  height: number | null;
  /** numeric(8,3) arrives as a string from pg. */
  fps: ColumnType<string | null, number | string | null, number | string | null>;
  video_codec: string | null;
  audio_codec: string | null;
  rotation: number | null;
  source_clip_id: number | null;
  source_start_ms: number | null;
  source_end_ms: number | null;
  proposed_cuts: ColumnType<number[] | null, string | null, string | null>;
  created_by: number | null;
  created_at: Timestamp;
  updated_at: Timestamp;
}

export interface GradingSchemesTable {
  id: Generated<number>;
  team_id: number;
  version: number;
  rules: ColumnType<unknown, string, string>;
  designated_grader_role: Generated<string>;
  created_by: number | null;
  created_at: Timestamp;
}

export interface DepthChartEntriesTable {
  season_id: number;
  /** The chart saved for this week is in force until a later week's chart (0: the base chart). */
  week: Generated<number>;
  position: string;
  rank: number;
  player_id: number;
}

export interface DepthChartChangesTable {
  id: Generated<number>;
  season_id: number;
  week: Generated<number>;
  changed_by: number | null;
  reason: string | null;
  before: ColumnType<unknown, string, string>;
  after: ColumnType<unknown, string, string>;
  created_at: Timestamp;
}

export interface SnapParticipantsTable {
  snap_id: number;
  player_id: number;
  position: string;
}

export interface GradesTable {
  id: Generated<number>;
  snap_id: number;
  player_id: number;
  grader_id: number;
  scheme_version: number;
  position: string | null;
  assignment: string | null;
  missed_reason: string | null;
  footwork: string | null;
  hands: string | null;
  pad_level: string | null;
  extra: ColumnType<Record<string, string | null>, string | undefined, string>;
  effort: string | null;
  knockdowns: Generated<number>;
  pressures_allowed: Generated<number>;
  sacks_allowed: Generated<number>;
  penalties: ColumnType<{ type: string }[], string | undefined, string>;
  penalty_count: Generated<number>;
  note: string | null;
  result: string | null;
  version: Generated<number>;
  created_at: Timestamp;
  updated_at: Timestamp;
  /** Kept by triggers (migration 20261204T000000_final_grade_flag): this grade is the one reports count. */
  is_final: ColumnType<boolean, never, never>;
}

/** The final grade per snap and player (view over grades where is_final; see the final-grade flag migration). */
export interface FinalGradesView extends GradesTable {
  session_id: number;
}

export interface GradingLockEventsTable {
  id: Generated<number>;
  session_id: number;
  action: string;
  by_user: number | null;
  reason: string | null;
  created_at: Timestamp;
}

export interface ClipCommentsTable {
  id: Generated<number>;
  team_id: number;
  clip_id: number;
  parent_id: number | null;
  author_id: number;
  at_ms: number;
  end_ms: number | null;
  kind: string;
  component: string | null;
  body: string;
  hidden_at: NullableTimestamp;
  hidden_by: number | null;
  created_at: Timestamp;
  updated_at: Timestamp;
}

export interface CommentRevisionsTable {
  id: Generated<number>;
  comment_id: number;
  body: string;
  edited_by: number | null;
  edited_at: Timestamp;
}

export interface CommentTargetsTable {
  comment_id: number;
  player_id: number;
  acknowledged_at: NullableTimestamp;
  digested_at: NullableTimestamp;
}

export interface ClipViewsTable {
  clip_id: number;
  player_id: number;
  ranges: ColumnType<[number, number][], string | undefined, string>;
  watched_ms: Generated<number>;
  last_seen_at: Timestamp;
}

export interface CutupsTable {
  id: Generated<number>;
  team_id: number;
  title: string;
  description: string | null;
  filter: ColumnType<unknown, string | null | undefined, string | null>;
  created_by: number | null;
  created_at: Timestamp;
  updated_at: Timestamp;
}

export interface CutupItemsTable {
  cutup_id: number;
  position: number;
  clip_id: number;
  note: string | null;
}

export interface CutupSharesTable {
  id: Generated<number>;
  cutup_id: number;
  player_id: number | null;
  position_group: string | null;
}

export interface MailPreferencesTable {
  user_id: number;
  coaching_digest: Generated<boolean>;
  digest_every_hours: Generated<number>;
  weekly_summary: Generated<boolean>;
  unsubscribe_token_hash: string | null;
  last_digest_at: NullableTimestamp;
  updated_at: Timestamp;
}

export interface PlayerGoalsTable {
  id: Generated<number>;
  player_id: number;
  component: string;
  /** numeric(4,3): a string from pg. */
  target: ColumnType<string, number | string, number | string>;
  due_on: DateString | null;
  note: string | null;
  set_by: number | null;
  achieved_at: NullableTimestamp;
  created_at: Timestamp;
}

export interface PlayerNotesTable {
  id: Generated<number>;
  player_id: number;
  author_id: number;
  body: string;
  created_at: Timestamp;
}

export interface DB {
  player_goals: PlayerGoalsTable;
  player_notes: PlayerNotesTable;
  clip_comments: ClipCommentsTable;
  comment_revisions: CommentRevisionsTable;
  comment_targets: CommentTargetsTable;
  clip_views: ClipViewsTable;
  cutups: CutupsTable;
  cutup_items: CutupItemsTable;
  cutup_shares: CutupSharesTable;
  mail_preferences: MailPreferencesTable;
  grading_schemes: GradingSchemesTable;
  depth_chart_entries: DepthChartEntriesTable;
  depth_chart_changes: DepthChartChangesTable;
  snap_participants: SnapParticipantsTable;
  grades: GradesTable;
  final_grades: FinalGradesView;
  grading_lock_events: GradingLockEventsTable;
  tag_list_items: TagListItemsTable;
  film_sessions: FilmSessionsTable;
  snaps: SnapsTable;
  clips: ClipsTable;
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
