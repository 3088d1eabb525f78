import type { Request, Response } from 'express';
import type { ZodType, z } from 'zod';
import type { Role } from '@shared/roles';
import type { AppContext } from './context';

/** The signed-in account as the session middleware loaded it. */
export interface SessionUser {
  id: number;
  email: string;
  name: string;
}

/** The caller's membership in the team a route is about, re-read from the database on every request. */
export interface TeamMembership {
  id: number;
  teamId: number;
  role: Role;
  playerId: number | null;
}

/**
 * Who may call a route. Deny by default: every route must say which of these it is.
 * - public: anyone, signed in or not;
 * - signedIn: any signed-in account;
 * - team: a member of the team that `team` resolves from the request (404 when the object does not
 *   exist, 403 when the caller is not an active member with one of `roles`).
 */
export type Access =
  | { kind: 'public' }
  | { kind: 'signedIn' }
  | { kind: 'team'; roles: readonly Role[]; team: (ctx: AppContext, params: any, req: Request) => Promise<number | null> };

export interface RouteResponse {
  description: string;
  schema?: ZodType;
  contentType?: string;
}

export interface HandlerArgs<P, Q, B> {
  app: AppContext;
  req: Request;
  res: Response;
  params: P;
  query: Q;
  body: B;
  user: SessionUser | null;
  membership: TeamMembership | null;
}

/** A reply with a status other than the route's first declared success status. */
export class Reply {
  constructor(readonly status: number, readonly body?: unknown) {}
}

export interface RouteDefinition<PS extends ZodType = ZodType, QS extends ZodType = ZodType, BS extends ZodType = ZodType> {
  operationId: string;
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** OpenAPI-style path under /api, e.g. '/teams/{teamId}/players'. */
  path: string;
  summary: string;
  tags: string[];
  access: Access;
  params?: PS;
  query?: QS;
  body?: BS;
  /** A multipart/form-data body, for the OpenAPI document only: the handler reads the stream itself. */
  multipartBody?: ZodType;
  responses: Record<number, RouteResponse>;
  /** Development-only routes are never mounted in production. */
  developmentOnly?: boolean;
  handler: (args: HandlerArgs<z.output<PS>, z.output<QS>, z.output<BS>>) => Promise<unknown>;
}

/** Typed identity helper: keeps the handler's argument types tied to the route's schemas. */
export function defineRoute<PS extends ZodType, QS extends ZodType, BS extends ZodType>(
  route: RouteDefinition<PS, QS, BS>,
): RouteDefinition {
  return route as unknown as RouteDefinition;
}

/** The team id taken straight from a `{teamId}` path parameter. */
export const teamFromPath = async (_ctx: AppContext, params: { teamId: number }) => params.teamId;
