/**
 * Property-based fuzzing of every JSON route in the OpenAPI document (issue 7).
 *
 * For each operation fast-check generates path parameters (ids of this team's own objects, of
 * another team's, small and huge integers, garbage strings), query strings (the declared
 * parameters with odd values, repeated keys, brackets, unknown keys) and bodies (values built
 * from the operation's own JSON schema, the same with one field of the wrong kind, the schema's
 * field names with arbitrary values, arbitrary JSON, huge strings, deep nesting, NUL, odd
 * Unicode, prototype keys, malformed JSON), sent as a signed-in admin of a fixture team with a
 * valid CSRF token, or now and then as an anonymous visitor (also with a valid pre-session token,
 * so the request gets past CSRF into the route).
 *
 * The property: no answer ≥ 500, no hang (15 s deadline), and every error answer is the JSON error
 * shape with error.code and error.message. The app runs in this process: an uncaught exception or
 * unhandled rejection fails the running test (jest-circus installs handlers for both), and the
 * app must still answer /api/health and keep the admin signed in at the end.
 *
 * Media routes also get Range headers; uploads get JSON bodies (multer ignores them) plus a few
 * malformed multipart requests written by hand. Bounded: RUNS per route (TW_FUZZ_RUNS), one
 * fast-check seed per file run (TW_FUZZ_SEED to replay one), the counts are printed at the end.
 */
import { randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import fc from 'fast-check';
import request from 'supertest';
import { createSession, waitForClips } from '../support/film';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../support/fixtures';
import { makeClip } from '../support/media-fixtures';
import { startTestApp, type TestApp } from '../support/test-app';
import { ApiClient } from '../support/api-client';

const RUNS = Number(process.env.TW_FUZZ_RUNS ?? 25);
// About 0.3 s per route and run at worst, sign-ins and shrinking included.
jest.setTimeout(Math.max(240_000, RUNS * 100 * 300));
const SEED = process.env.TW_FUZZ_SEED ? Number(process.env.TW_FUZZ_SEED) : Date.now() ^ (Math.random() * 0x7fffffff);
const DEADLINE_MS = 15_000;

// ---------------------------------------------------------------------------------------------
// The OpenAPI document's shapes, as far as the generators read them.

interface JsonSchema {
  type?: string | string[];
  enum?: unknown[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  additionalProperties?: JsonSchema | boolean;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minLength?: number;
  maxLength?: number;
  minItems?: number;
  maxItems?: number;
  format?: string;
  pattern?: string;
}

interface Parameter {
  name: string;
  in: 'path' | 'query' | 'header' | 'cookie';
  schema?: JsonSchema;
}

interface Operation {
  operationId: string;
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  parameters: Parameter[];
  body: JsonSchema | undefined;
}

interface FilmObjects {
  sessionId: number;
  snapId: number;
  clipId: number;
  commentId: number;
  cutupId: number;
  tagItemId: number;
  goalId: number;
  invitationId: number;
  membershipId: number;
}

// ---------------------------------------------------------------------------------------------
// Generators.

/** Strings that have broken servers before: empty, blanks, NUL, BOM, RTL override, astral, combining marks, SQL and path bits. */
const SPECIAL_STRINGS = [
  '',
  ' ',
  '\u0000',
  'a\u0000b',
  '\uFEFF',
  '\u202Eevil',
  '𝕏𝕐ℤ',
  '👨‍👩‍👧‍👦',
  'e\u0301\u0301\u0301',
  "'; drop table users; --",
  '../../etc/passwd',
  '%00',
  '%',
  '\\',
  '\ud800',
  'null',
  'undefined',
  '[object Object]',
  '__proto__',
  'constructor',
  '0',
  '-1',
  '1e309',
  '2026-02-30',
  '0000-01-01',
  '9999-12-31',
  '2026-13-01',
  'T'.repeat(300),
];
const SPECIAL_NUMBERS = [0, -0, -1, 1, 0.5, -1.5, 2 ** 31 - 1, 2 ** 31, 2 ** 32, 2 ** 53 - 1, 2 ** 53 + 2, -(2 ** 53), 1e21, 1e308, -1e308, 5e-324];

const oddString = fc.oneof(fc.constantFrom(...SPECIAL_STRINGS), fc.string({ unit: 'binary', maxLength: 40 }), fc.string({ unit: 'grapheme', maxLength: 40 }));
const oddNumber = fc.oneof(fc.constantFrom(...SPECIAL_NUMBERS), fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer());

/** Any value of any JSON kind, biased toward the awkward ones. */
const nastyValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 3, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
  { weight: 2, arbitrary: oddString },
  { weight: 2, arbitrary: oddNumber },
  { weight: 1, arbitrary: fc.constantFrom(null, true, false, [], {}, [null], { '': null }) },
  { weight: 1, arbitrary: fc.array(oddString, { maxLength: 4 }) },
);

const DATE_LIKE = fc.oneof(
  fc.tuple(fc.integer({ min: 0, max: 9999 }), fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 28 })).map(
    ([y, m, d]) => `${String(y).padStart(4, '0')}-${String(m).padStart(2, '0')}-${String(d).padStart(2, '0')}`,
  ),
  fc.date({ min: new Date('1900-01-01'), max: new Date('2100-12-31'), noInvalidDate: true }).map((d) => d.toISOString().slice(0, 10)),
  fc.constantFrom('2024-02-29', '2026-02-29', '2026-04-31', '0000-01-01', '0001-01-01', '9999-12-31'),
);

/** Accounts the generators may name: every fixture account but the admin the fuzzer signs in as (failed sign-ins would lock it). */
let knownEmails: string[] = [];

function isIdKey(key: string): boolean {
  return /(^id$|Id$|Ids$)/.test(key);
}

/** Numeric bounds a JSON schema states, clamped to what fast-check's integer generator takes. */
function integerBounds(schema: JsonSchema): { min: number; max: number; exactMin: number; exactMax: number } {
  const exactMin = schema.minimum ?? (schema.exclusiveMinimum !== undefined ? schema.exclusiveMinimum + 1 : -(2 ** 53 - 1));
  const exactMax = schema.maximum ?? (schema.exclusiveMaximum !== undefined ? schema.exclusiveMaximum - 1 : 2 ** 53 - 1);
  return { min: Math.max(exactMin, -(2 ** 31)), max: Math.min(exactMax, 2 ** 31 - 1), exactMin, exactMax };
}

/**
 * Values that fit the schema (its types, enums, bounds, formats and lengths, edges included), so
 * that requests get past validation into the services and the database. Integer fields named
 * like ids take known ids (both teams') most of the time.
 */
function fromSchema(schema: JsonSchema | undefined, key: string, knownIds: number[], depth = 0): fc.Arbitrary<unknown> {
  if (!schema || depth > 6) return nastyValue;
  if (schema.enum) return fc.constantFrom(...schema.enum);
  const alternatives = schema.anyOf ?? schema.oneOf;
  if (alternatives) return fc.oneof(...alternatives.map((s) => fromSchema(s, key, knownIds, depth + 1)));
  if (Array.isArray(schema.type)) return fc.oneof(...schema.type.map((type) => fromSchema({ ...schema, type }, key, knownIds, depth)));
  switch (schema.type) {
    case 'null':
      return fc.constant(null);
    case 'boolean':
      return fc.boolean();
    case 'integer': {
      const { min, max, exactMin, exactMax } = integerBounds(schema);
      const plain = min <= max ? fc.integer({ min, max }) : fc.constant(exactMin);
      const edges = fc.constantFrom(exactMin, exactMax);
      return isIdKey(key) && knownIds.length ? fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...knownIds) }, plain, edges) : fc.oneof({ weight: 4, arbitrary: plain }, edges);
    }
    case 'number': {
      const min = schema.minimum ?? schema.exclusiveMinimum ?? -1e6;
      const max = schema.maximum ?? schema.exclusiveMaximum ?? 1e6;
      return fc.oneof(fc.double({ min, max, noNaN: true }), fc.constantFrom(min, max));
    }
    case 'string': {
      if (schema.format === 'date') return DATE_LIKE;
      if (schema.format === 'email' || /email/i.test(key)) return knownEmails.length ? fc.oneof(fc.emailAddress(), fc.constantFrom(...knownEmails)) : fc.emailAddress();
      if (/password/i.test(key)) return fc.oneof(fc.constant(TEST_PASSWORD), fc.string({ minLength: schema.minLength ?? 0, maxLength: 80 }));
      if (schema.pattern) {
        try {
          return fc.stringMatching(new RegExp(schema.pattern), { size: 'small' });
        } catch {
          // A pattern fast-check cannot read: fall through to plain strings.
        }
      }
      const minLength = schema.minLength ?? 0;
      const maxLength = schema.maxLength ?? 80;
      const text = fc.string({ unit: 'grapheme', minLength, maxLength: Math.min(maxLength, Math.max(minLength, 60)) });
      const full = fc.constant('x'.repeat(maxLength));
      return schema.maxLength !== undefined ? fc.oneof({ weight: 5, arbitrary: text }, full) : text;
    }
    case 'array': {
      const item = fromSchema(schema.items, key, knownIds, depth + 1);
      const minLength = schema.minItems ?? 0;
      return fc.array(item, { minLength, maxLength: Math.max(minLength, Math.min(schema.maxItems ?? 6, 6)) });
    }
    case 'object':
    default: {
      const props = schema.properties ?? {};
      const record = fc.record(
        Object.fromEntries(Object.entries(props).map(([name, inner]) => [name, fromSchema(inner, name, knownIds, depth + 1)])),
        { requiredKeys: (schema.required ?? []).filter((name) => name in props) },
      );
      if (schema.additionalProperties && typeof schema.additionalProperties === 'object') {
        const extra = fc.dictionary(fc.string({ maxLength: 12 }), fromSchema(schema.additionalProperties, key, knownIds, depth + 1), { maxKeys: 3 });
        return fc.tuple(record, extra).map(([a, b]) => ({ ...b, ...a }));
      }
      return record;
    }
  }
}

type Body = { kind: 'none' } | { kind: 'json'; value: unknown } | { kind: 'raw'; text: string; contentType: string };

function deepArray(depth: number): string {
  return `${'['.repeat(depth)}${']'.repeat(depth)}`;
}
function deepObject(depth: number, key: string): string {
  return `${`{"${key}":`.repeat(depth)}1${'}'.repeat(depth)}`;
}

/** Every kind of body, for an operation whose JSON schema is `schema` (field names taken from it). */
function bodyArbitrary(schema: JsonSchema | undefined, knownIds: number[]): fc.Arbitrary<Body> {
  const names = Object.keys(schema?.properties ?? {});
  const someName = names.length ? fc.constantFrom(...names) : fc.constant('value');
  const valid = fromSchema(schema ?? { type: 'object' }, '', knownIds);
  const json = (value: fc.Arbitrary<unknown>) => value.map((v): Body => ({ kind: 'json', value: v }));
  const raw = (text: fc.Arbitrary<string>, contentType = 'application/json') => text.map((t): Body => ({ kind: 'raw', text: t, contentType }));
  return fc.oneof(
    { weight: 12, arbitrary: json(valid) },
    // One field of the wrong kind in an otherwise fitting body.
    {
      weight: 5,
      arbitrary: json(
        fc.tuple(valid, someName, nastyValue).map(([v, name, bad]) => (v && typeof v === 'object' && !Array.isArray(v) ? { ...v, [name]: bad } : { [name]: bad })),
      ),
    },
    // The schema's field names, arbitrary values.
    { weight: 3, arbitrary: json(fc.record(Object.fromEntries((names.length ? names : ['value']).map((n) => [n, nastyValue])), { requiredKeys: [] })) },
    { weight: 2, arbitrary: json(fc.jsonValue({ maxDepth: 4 })) },
    { weight: 1, arbitrary: fc.constant<Body>({ kind: 'none' }) },
    // Huge strings: one under the 2 MB body limit, one over it.
    { weight: 1, arbitrary: json(fc.tuple(someName, fc.constantFrom(100_000, 1_500_000, 2_200_000)).map(([name, n]) => ({ [name]: 'ü'.repeat(n / 2) }))) },
    // Deep nesting, as text (JSON.stringify of such values would itself overflow).
    {
      weight: 1,
      arbitrary: raw(
        fc.oneof(
          fc.constantFrom(1_000, 20_000, 200_000).map(deepArray),
          fc.tuple(fc.constantFrom(1_000, 20_000, 200_000), someName).map(([d, name]) => deepObject(d, name)),
          fc.tuple(fc.constantFrom(1_000, 50_000), someName).map(([d, name]) => `{"${name}":${deepArray(d)}}`),
        ),
      ),
    },
    // NUL and odd Unicode in every field.
    { weight: 1, arbitrary: json(fc.tuple(valid, oddString).map(([v, s]) => (v && typeof v === 'object' && !Array.isArray(v) ? Object.fromEntries(Object.keys(v).map((k) => [k, s])) : s))) },
    // Prototype pollution attempts and mass-assignment keys.
    {
      weight: 1,
      arbitrary: raw(
        fc.tuple(valid, fc.constantFrom('__proto__', 'constructor', 'prototype', 'teamId', 'role', 'id', 'version', 'graderId')).map(
          ([v, key]) => {
            const base = v && typeof v === 'object' && !Array.isArray(v) ? JSON.stringify(v).slice(1, -1) : '';
            return `{${base}${base ? ',' : ''}"${key}":{"polluted":true,"role":"admin","isAdmin":true}}`;
          },
        ),
      ),
    },
    // Not JSON at all, or not what the header says.
    {
      weight: 1,
      arbitrary: fc.oneof(
        raw(fc.constantFrom('{', '{"a":', '[1,]', "{'a':1}", 'NaN', '"just a string"', '12', 'null', '\u0000', '{"a":1}{"b":2}', '\uFEFF{}')),
        raw(fc.string({ maxLength: 40 }), 'text/plain'),
        raw(fc.constantFrom('a=1&b[c]=2', 'teamId=1'), 'application/x-www-form-urlencoded'),
        raw(fc.constant('{}'), 'application/json; charset=utf-16'),
        raw(fc.constant('{}'), 'application/json; charset=koi8-r'),
      ),
    },
  );
}

/** Percent-encodes a generated string; a lone surrogate cannot be encoded, so it is made well-formed first. */
function encodeSegment(value: string): string {
  // String.prototype.toWellFormed is in Node 20; the ES2023 lib types do not know it yet.
  return encodeURIComponent((value as string & { toWellFormed(): string }).toWellFormed());
}

function pathParamArbitrary(own: string[], other: string[]): fc.Arbitrary<string> {
  // Half the time this team's own object, so that most requests get past authorization.
  return fc.oneof(
    { weight: 9, arbitrary: fc.constantFrom(...own) },
    { weight: 2, arbitrary: other.length ? fc.constantFrom(...other) : fc.constant('1') },
    { weight: 2, arbitrary: fc.integer({ min: -3, max: 40 }).map(String) },
    { weight: 1, arbitrary: fc.constantFrom(...SPECIAL_NUMBERS).map((n) => String(n)) },
    { weight: 1, arbitrary: fc.constantFrom('0x10', '1e3', ' 1', '1 ', '+1', '٣', '１', 'NaN', 'Infinity', 'null', '[]', '1,2', '1;2', '99999999999999999999999').map(encodeSegment) },
    { weight: 2, arbitrary: oddString.filter((s) => s.length > 0).map(encodeSegment) },
    // Raw bytes a browser would never send: malformed percent-encoding and dot segments.
    { weight: 1, arbitrary: fc.constantFrom('%', '%zz', '%E0%A4%A', '%C0%AF', '%00', '%2e%2e', '..', '.') },
  );
}

const QUERY_VALUE = fc.oneof(
  fc.integer({ min: -2, max: 40 }).map(String),
  fc.constantFrom('', 'true', 'snap', 'game', 'practice', 'scrimmage', '2026-09-18', '1,2', '1,1', '1,2,3,4,5,6,7,8,9,10,11', ',', '-1', '1.5', '9007199254740993', 'NaN'),
  oddString,
);

function queryArbitrary(op: Operation, known: string[]): fc.Arbitrary<string> {
  const declared = op.parameters.filter((p) => p.in === 'query').map((p) => p.name);
  const value = fc.oneof({ weight: 2, arbitrary: fc.constantFrom(...known) }, { weight: 3, arbitrary: QUERY_VALUE });
  const pair = fc.tuple(
    fc.oneof({ weight: 5, arbitrary: declared.length ? fc.constantFrom(...declared) : fc.constant('q') }, { weight: 1, arbitrary: fc.constantFrom('__proto__', 'constructor', 'a[b]', 'teamId[]', '') }),
    value,
  );
  return fc.array(pair, { maxLength: 5 }).map((pairs) => pairs.map(([k, v]) => `${encodeSegment(k)}=${encodeSegment(v)}`).join('&'));
}

const RANGE = fc.oneof(
  fc.constant(undefined),
  fc.constantFrom('bytes=0-', 'bytes=0-99', 'bytes=-100', 'bytes=100-', 'bytes=99999999-', 'bytes=5-1', 'bytes=0-0', 'bytes=0-1,5-6', 'bytes=', 'bytes=-', 'items=0-1', 'bytes=18446744073709551616-'),
  fc.string({ unit: fc.integer({ min: 0x20, max: 0x7e }).map((c) => String.fromCharCode(c)), maxLength: 30 }),
);

// ---------------------------------------------------------------------------------------------
// The app, the fixture, and the bookkeeping.

let t: TestApp;
let server: Server;
let baseUrl: string;
let team: TeamFixture;
let other: TeamFixture;
let own: FilmObjects & { readyClipId: number };
let theirs: FilmObjects;
let operations: Operation[];
let admin: ReturnType<typeof request.agent>;
let adminToken = '';

const statuses = new Map<number, number>();
const perRoute = new Map<string, Map<number, number>>();
const failures: { operationId: string; status: number | string; request: string; response: string }[] = [];
const counterexamples: string[] = [];
let requestsSent = 0;
let adminRestores = 0;

function tokenFrom(res: request.Response): string | undefined {
  const cookies = ([] as string[]).concat((res.headers['set-cookie'] as unknown as string[] | undefined) ?? []);
  for (const cookie of cookies) {
    const match = /^XSRF-TOKEN=([^;]*)/.exec(cookie);
    if (match) return decodeURIComponent(match[1]!);
  }
  return undefined;
}

async function signIn(agent: ReturnType<typeof request.agent>, email: string): Promise<string> {
  const primed = await agent.get('/api/health');
  const pre = tokenFrom(primed);
  const res = await agent.post('/api/auth/login').set('X-XSRF-TOKEN', pre ?? '').send({ email, password: TEST_PASSWORD });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  return tokenFrom(res) ?? pre ?? '';
}

async function anonymousAgent(): Promise<{ agent: ReturnType<typeof request.agent>; token: string }> {
  const agent = request.agent(baseUrl);
  const res = await agent.get('/api/health');
  return { agent, token: tokenFrom(res) ?? '' };
}

async function filmObjects(app: TestApp, f: TeamFixture): Promise<FilmObjects> {
  const db = app.ctx.db;
  const session = await db
    .insertInto('film_sessions')
    .values({ team_id: f.teamId, season_id: f.seasonId, kind: 'game', title: 'Week 1', date: '2026-09-04', opponent: 'Hollow Creek' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const snap = await db.insertInto('snaps').values({ session_id: session.id, order: 1 }).returning('id').executeTakeFirstOrThrow();
  await db.insertInto('snaps').values({ session_id: session.id, order: 2 }).execute();
  const clip = await db
    .insertInto('clips')
    .values({ team_id: f.teamId, session_id: session.id, snap_id: snap.id, upload_order: 1, original_name: 'play1.mp4', status: 'failed', failure_reason: 'not a video file' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const comment = await db
    .insertInto('clip_comments')
    .values({ team_id: f.teamId, clip_id: clip.id, author_id: f.accounts.coach.userId, at_ms: 0, kind: 'teaching', body: 'Hat on the 3 technique.' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const cutup = await db.insertInto('cutups').values({ team_id: f.teamId, title: 'Pad level', created_by: f.accounts.coach.userId }).returning('id').executeTakeFirstOrThrow();
  const item = await db.insertInto('tag_list_items').values({ team_id: f.teamId, kind: 'front', name: 'over' }).returning('id').executeTakeFirstOrThrow();
  const goal = await db
    .insertInto('player_goals')
    .values({ player_id: f.playerIds[0]!, component: 'footwork', target: '0.800', set_by: f.accounts.coach.userId })
    .returning('id')
    .executeTakeFirstOrThrow();
  const invitation = await db
    .insertInto('invitations')
    .values({ team_id: f.teamId, email: `pending.${f.teamId}@fuzz.test`, role: 'coach', token_hash: randomBytes(32).toString('hex'), invited_by: f.accounts.admin.userId, expires_at: new Date(Date.now() + 3_600_000) })
    .returning('id')
    .executeTakeFirstOrThrow();
  const membership = await db.selectFrom('memberships').select('id').where('user_id', '=', f.accounts.coach.userId).executeTakeFirstOrThrow();
  return {
    sessionId: session.id,
    snapId: snap.id,
    clipId: clip.id,
    commentId: comment.id,
    cutupId: cutup.id,
    tagItemId: item.id,
    goalId: goal.id,
    invitationId: invitation.id,
    membershipId: membership.id,
  };
}

/** Candidate values of a path parameter: this team's objects first, then the other team's. */
function ownAndOther(op: Operation, name: string): { own: string[]; other: string[] } {
  const pick = (f: TeamFixture, o: FilmObjects, ready?: number): string[] => {
    const prefix = op.path;
    const byName: Record<string, number[]> = {
      teamId: [f.teamId],
      snapId: [o.snapId],
      playerId: f.playerIds,
      itemId: [o.tagItemId],
      invitationId: [o.invitationId],
      membershipId: [o.membershipId],
      goalId: [o.goalId],
    };
    if (name === 'id') {
      if (prefix.startsWith('/api/film-sessions/')) return [String(o.sessionId)];
      if (prefix.startsWith('/api/snaps/')) return [String(o.snapId)];
      if (prefix.startsWith('/api/comments/')) return [String(o.commentId)];
      if (prefix.startsWith('/api/cutups/')) return [String(o.cutupId)];
      if (prefix.startsWith('/api/players/')) return f.playerIds.map(String);
      if (prefix.startsWith('/api/clips/')) return [o.clipId, ...(ready ? [ready] : [])].map(String);
    }
    if (name === 'token') return ['not-a-real-token-0123456789', 'a'.repeat(43)];
    const ids = byName[name];
    if (!ids) throw new Error(`No fuzz values for path parameter ${name} of ${op.operationId}: add it`);
    return ids.map(String);
  };
  return { own: pick(team, own, own.readyClipId), other: pick(other, theirs) };
}

interface Case {
  anonymous: boolean;
  params: string[];
  query: string;
  body: Body;
  range: string | undefined;
}

function caseArbitrary(op: Operation): fc.Arbitrary<Case> {
  const names = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]!);
  const knownIds = [
    team.teamId,
    other.teamId,
    ...team.playerIds,
    ...other.playerIds,
    ...Object.values(own),
    ...Object.values(theirs),
    team.accounts.coach.userId,
    team.accounts.coordinator.userId,
    team.seasonId,
    other.seasonId,
  ];
  const knownQuery = [...new Set(knownIds)].map(String).concat([`${team.playerIds[0]},${team.playerIds[2]}`]);
  const isMedia = /\/(poster|strip|playback)$/.test(op.path);
  return fc.record({
    anonymous: fc.oneof({ weight: 6, arbitrary: fc.constant(false) }, { weight: 1, arbitrary: fc.constant(true) }),
    params: fc.tuple(...names.map((n) => {
      const values = ownAndOther(op, n);
      return pathParamArbitrary(values.own, values.other);
    })) as fc.Arbitrary<string[]>,
    query: op.method === 'get' || op.parameters.some((p) => p.in === 'query') ? queryArbitrary(op, knownQuery) : fc.constant(''),
    body: op.method === 'get' || op.method === 'delete' ? fc.constant<Body>({ kind: 'none' }) : op.body ? bodyArbitrary(op.body, knownIds) : fc.oneof(fc.constant<Body>({ kind: 'none' }), bodyArbitrary(undefined, knownIds)),
    range: isMedia ? RANGE : fc.constant(undefined),
  });
}

/**
 * Inputs that once answered 500, replayed first on every run (fast-check `examples`), with the
 * path parameters pointing at this team's own objects.
 */
function regressions(op: Operation): Case[] {
  const names = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]!);
  const params = names.map((n) => ownAndOther(op, n).own[0]!);
  const json = (value: unknown): Case => ({ anonymous: false, params, query: '', body: { kind: 'json', value }, range: undefined });
  const cases: Case[] = [];
  // 20 000 nested arrays overflowed the call stack of the NUL check that runs before every route.
  if (op.method !== 'get' && op.method !== 'delete') cases.push({ anonymous: false, params, query: '', body: { kind: 'raw', text: deepArray(20_000), contentType: 'application/json' }, range: undefined });
  // A positive target that rounds to 0.000 in numeric(4,3) broke the table's CHECK (target > 0).
  if (op.operationId === 'addPlayerGoal') cases.push(json({ component: 'overall', target: 5e-324 }), json({ component: 'hands', target: 0.0004 }));
  if (op.operationId === 'updatePlayerGoal') cases.push(json({ target: 5e-324 }));
  // Year 0000 passes the ISO date pattern, but PostgreSQL has no year zero.
  if (op.operationId === 'createFilmSession') cases.push(json({ teamId: team.teamId, kind: 'game', title: 'Year zero', date: '0000-01-01' }));
  if (op.operationId === 'addPlayerGoal') cases.push(json({ component: 'overall', target: 0.5, dueOn: '0000-01-01' }));
  return cases;
}

function urlOf(op: Operation, params: string[], query: string): string {
  let i = 0;
  const path = op.path.replace(/\{\w+\}/g, () => params[i++]!);
  return query ? `${path}?${query}` : path;
}

function describeCase(op: Operation, c: Case): string {
  const body = c.body.kind === 'none' ? '' : c.body.kind === 'json' ? JSON.stringify(c.body.value) : `(${c.body.contentType}) ${c.body.text}`;
  const short = (s: string) => (s.length > 300 ? `${s.slice(0, 300)}… (${s.length} chars)` : s);
  return `${op.method.toUpperCase()} ${short(urlOf(op, c.params, c.query))}${c.anonymous ? ' [anonymous]' : ''}${c.range ? ` Range: ${c.range}` : ''} ${short(body)}`;
}

/** One line per route and status: how often, and the shortest request that did it. */
function summarizeFailures(): string[] {
  const groups = new Map<string, (typeof failures)[number][]>();
  for (const f of failures) groups.set(`${f.operationId} → ${f.status}`, [...(groups.get(`${f.operationId} → ${f.status}`) ?? []), f]);
  return [...groups].map(([key, list]) => {
    const shortest = list.reduce((a, b) => (b.request.length < a.request.length ? b : a));
    return `${key} ×${list.length}: ${shortest.request}\n      ⇒ ${shortest.response}`;
  });
}

function count(operationId: string, status: number): void {
  requestsSent += 1;
  statuses.set(status, (statuses.get(status) ?? 0) + 1);
  const route = perRoute.get(operationId) ?? new Map<number, number>();
  route.set(status, (route.get(status) ?? 0) + 1);
  perRoute.set(operationId, route);
}

/** What is wrong with an answer, or null: ≥ 500, or an error without the JSON error shape. */
function problemWith(res: request.Response): string | null {
  if (res.status >= 500) return `status ${res.status}`;
  if (res.status >= 400) {
    const error = (res.body as { error?: { code?: unknown; message?: unknown } } | undefined)?.error;
    if (typeof error?.code !== 'string' || typeof error?.message !== 'string') return `status ${res.status} without {"error":{"code","message"}}`;
  }
  return null;
}

async function send(op: Operation, c: Case): Promise<request.Response> {
  const { agent, token } = c.anonymous ? await anonymousAgent() : { agent: admin, token: adminToken };
  let req = agent[op.method](urlOf(op, c.params, c.query)).timeout({ deadline: DEADLINE_MS }).set('X-XSRF-TOKEN', token);
  if (c.range) req = req.set('Range', c.range);
  if (c.body.kind === 'json') req = req.set('Content-Type', 'application/json').send(JSON.stringify(c.body.value));
  else if (c.body.kind === 'raw') req = req.set('Content-Type', c.body.contentType).send(c.body.text);
  const res = await req;
  // Sign-in and sign-out hand out a new token, as the browser's cookie would follow.
  if (!c.anonymous) adminToken = tokenFrom(res) ?? adminToken;
  return res;
}

/** Brings the fixture admin back if a fuzzed request took the session or the role away (sign-out, role change). */
async function keepAdminSignedIn(): Promise<void> {
  const me = await admin.get('/api/auth/me');
  const membership = await t.ctx.db.selectFrom('memberships').select(['role', 'active']).where('user_id', '=', team.accounts.admin.userId).executeTakeFirstOrThrow();
  // A fuzzed sign-in may have turned this agent into another account: compare the account, not just the status.
  if (me.status === 200 && (me.body as { user?: { id?: number } }).user?.id === team.accounts.admin.userId && membership.role === 'admin' && membership.active) return;
  adminRestores += 1;
  await t.ctx.db.updateTable('memberships').set({ role: 'admin', active: true }).where('user_id', '=', team.accounts.admin.userId).execute();
  await t.ctx.db.updateTable('users').set({ active: true }).where('id', '=', team.accounts.admin.userId).execute();
  admin = request.agent(baseUrl);
  adminToken = await signIn(admin, team.accounts.admin.email);
}

beforeAll(async () => {
  t = await startTestApp();
  server = createServer(t.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  team = await createTeamFixture(t.ctx.db, 'Fuzz');
  other = await createTeamFixture(t.ctx.db, 'Other');
  own = { ...(await filmObjects(t, team)), readyClipId: 0 };
  theirs = await filmObjects(t, other);
  knownEmails = [
    ...Object.entries(team.accounts).filter(([role]) => role !== 'admin').map(([, a]) => a.email),
    ...Object.values(other.accounts).map((a) => a.email),
    `pending.${team.teamId}@fuzz.test`,
  ];

  // One real processed clip, so the media routes stream real bytes under fuzzed Range headers.
  await t.startWorker();
  const uploader = new ApiClient(t.app);
  expect((await uploader.login(team.accounts.coach.email, TEST_PASSWORD)).status).toBe(200);
  const sessionId = await createSession(uploader, team.teamId, { title: 'Fuzz film' });
  const file = await makeClip(process.env.TW_TEST_RUN_DIR ?? '/tmp', { seconds: 1, width: 160, height: 120, name: `fuzz-${process.pid}.mp4` });
  const uploaded = await uploader.upload(`/api/film-sessions/${sessionId}/clips`, [{ path: file }]);
  expect(uploaded.status).toBe(201);
  const [ready] = await waitForClips(uploader, sessionId, { count: 1 });
  expect(ready!.status).toBe('ready');
  own.readyClipId = ready!.id;

  admin = request.agent(baseUrl);
  adminToken = await signIn(admin, team.accounts.admin.email);

  const doc = (await admin.get('/api/openapi.json')).body as {
    paths: Record<string, Record<string, { operationId: string; parameters?: Parameter[]; requestBody?: { content?: Record<string, { schema?: JsonSchema }> } }>>;
  };
  operations = Object.entries(doc.paths).flatMap(([path, methods]) =>
    Object.entries(methods).map(([method, op]) => ({
      operationId: op.operationId,
      method: method as Operation['method'],
      path,
      parameters: op.parameters ?? [],
      body: op.requestBody?.content?.['application/json']?.schema,
    })),
  );
  // Removals last (a removed object answers 404 to everything after), the clip after its
  // comments, and sign-out at the very end.
  const last = (o: Operation) => Number(o.method === 'delete') + Number(o.operationId === 'removeClip') + 3 * Number(o.operationId === 'logout');
  operations.sort((a, b) => last(a) - last(b));
}, 120_000);

afterAll(async () => {
  const histogram = [...statuses].sort(([a], [b]) => a - b).map(([s, n]) => `${s}: ${n}`).join(', ');
  const routes = [...perRoute].map(([id, m]) => `  ${id.padEnd(24)} ${[...m].sort(([a], [b]) => a - b).map(([s, n]) => `${s}×${n}`).join(' ')}`);
  console.log(
    [
      `fuzz-routes: seed ${SEED}, ${RUNS} runs per route, ${operations?.length ?? 0} operations`,
      `requests sent: ${requestsSent} (plus sign-ins and CSRF priming); admin restored ${adminRestores}×`,
      `statuses: ${histogram}`,
      `failures: ${failures.length}`,
      ...summarizeFailures().map((line) => `  ${line}`),
      'per route:',
      ...routes,
    ].join('\n'),
  );
  await new Promise<void>((resolve) => server?.close(() => resolve()));
  await t?.close();
});

test('the document lists the operations the fuzzer knows how to address', () => {
  expect(operations.length).toBeGreaterThan(80);
  // Every path parameter has values (ownAndOther throws for an unknown one).
  for (const op of operations) for (const m of op.path.matchAll(/\{(\w+)\}/g)) ownAndOther(op, m[1]!);
});

test('fuzzing every operation: no 5xx, no hang, every error in the JSON error shape', async () => {
  for (const [index, op] of operations.entries()) {
    const details = await fc.check(
      fc.asyncProperty(caseArbitrary(op), async (c) => {
        let res: request.Response;
        try {
          res = await send(op, c);
        } catch (error) {
          // A deadline or a dropped connection: the server hung or hung up.
          const message = error instanceof Error ? error.message : String(error);
          count(op.operationId, -1);
          failures.push({ operationId: op.operationId, status: 'no answer', request: describeCase(op, c), response: message });
          return false;
        }
        count(op.operationId, res.status);
        const problem = problemWith(res);
        if (problem) failures.push({ operationId: op.operationId, status: res.status, request: describeCase(op, c), response: res.text.slice(0, 300) });
        return problem === null;
      }),
      // Shrinking is capped so that one failing route cannot eat the time budget.
      { numRuns: RUNS, seed: SEED + index, examples: regressions(op).map((c) => [c] as [Case]), endOnFailure: false, interruptAfterTimeLimit: 20_000, markInterruptAsFailure: false },
    );
    if (details.failed && details.counterexample) counterexamples.push(`${op.operationId} (seed ${SEED + index}): ${describeCase(op, details.counterexample[0])}`);
    await keepAdminSignedIn();
  }
  // Malformed multipart uploads, by hand: no boundary, a cut-off body, a broken part header, no file, an oversized field.
  const uploadPath = `/api/film-sessions/${own.sessionId}/clips`;
  const malformed: { contentType: string; body: string }[] = [
    { contentType: 'multipart/form-data', body: '--x\r\nContent-Disposition: form-data; name="files"; filename="a.mp4"\r\n\r\nabc\r\n--x--\r\n' },
    { contentType: 'multipart/form-data; boundary=x', body: '--x\r\nContent-Disposition: form-data; name="files"; filename="a.mp4"\r\n\r\n\u0000\u0000\u0000\u0018ftypisom' },
    { contentType: 'multipart/form-data; boundary=x', body: '--x\r\nContent-Disposition: form-data; name="files"; filename="a\u0001\nb.mp4"\r\n\r\nabc\r\n--x--\r\n' },
    { contentType: 'multipart/form-data; boundary=x', body: '--x\r\nContent-Disposition: form-data; name="angle"\r\n\r\nsideline\r\n--x--\r\n' },
    { contentType: 'multipart/form-data; boundary=x', body: `--x\r\nContent-Disposition: form-data; name="angle"\r\n\r\n${'a'.repeat(5000)}\r\n--x--\r\n` },
    { contentType: 'multipart/form-data; boundary=x', body: '--x\r\nContent-Disposition: form-data; name="other"; filename="a.mp4"\r\n\r\nabc\r\n--x--\r\n' },
    { contentType: 'multipart/form-data; boundary=x', body: '--x\r\nGarbage header line\r\n\r\nabc\r\n--x--\r\n' },
  ];
  for (const m of malformed) {
    const res = await admin.post(uploadPath).timeout({ deadline: DEADLINE_MS }).set('X-XSRF-TOKEN', adminToken).set('Content-Type', m.contentType).send(m.body);
    count('uploadClips (multipart)', res.status);
    const problem = problemWith(res);
    if (problem) failures.push({ operationId: 'uploadClips (multipart)', status: res.status, request: m.body.slice(0, 120), response: res.text.slice(0, 300) });
  }
  // None of the malformed uploads left a clip behind.
  const clips = await t.ctx.db.selectFrom('clips').select('id').where('session_id', '=', own.sessionId).execute();
  expect(clips.length).toBeLessThanOrEqual(1);

  expect({ failures: summarizeFailures(), counterexamples }).toEqual({ failures: [], counterexamples: [] });
  expect(requestsSent).toBeGreaterThanOrEqual(operations.length * RUNS);
});

test('afterwards the app still answers, and the admin is still signed in', async () => {
  await keepAdminSignedIn();
  const restoresBefore = adminRestores;
  const health = await admin.get('/api/health');
  expect(health.status).toBe(200);
  expect(health.body.database).toBe('ok');
  expect((await admin.get('/api/auth/me')).status).toBe(200);
  await keepAdminSignedIn();
  expect(adminRestores).toBe(restoresBefore);
});
