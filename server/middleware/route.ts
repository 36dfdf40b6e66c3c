/**
 * The typed route helper: every handler is written as
 *
 *     router.post("/:id/publish", ...route({ allow: "vehicle.publish", params: vehicleIdParams, body: publishSchema },
 *       ({ user, params, body }) => service.publish(ctx, user, params.id, body)));
 *
 * and receives its input parsed by the shared zod schemas and typed by them, with no casts. The pipeline it builds is
 * the one every route keeps (../shared/STYLE.md habit 1): guard (401 nobody signed in, 403 a role the permissions
 * table does not list) → params → query → any extra middleware (multipart) → body → handler → JSON. A schema that
 * needs the dealership's calendar day is given as a function of that day; the dealership is read once per request
 * (`day()`, memoised) and the same row reaches the service, which need not read it again.
 *
 * The guard and each validator keep what they check on the function (`guardInfo`, `validatorInfo`), so the route
 * inventory of the tests (tests/support/routes.ts) reads a route's action and schemas from the router itself.
 */
import type { NextFunction, Request, RequestHandler, Response } from "express";
import type { User } from "lucia";
import type { z } from "zod";
import type { DealershipDay } from "../lib/clock.ts";
import { can, type Action } from "../../shared/permissions.ts";
import { forbidden, unauthorized } from "../lib/errors.ts";
import { parseOr400, tagValidator, type Part } from "./validate.ts";

export type { DealershipDay };

declare module "express-serve-static-core" {
  interface Locals {
    /** Set by `dealershipDay()` (server/app.ts): reads the signed-in user's dealership on first call, then remembers it. */
    day?: () => Promise<DealershipDay>;
  }
}

/** A schema, or a schema built from the dealership's calendar day (dates "in the future" depend on it). */
export type SchemaFor = z.ZodType | ((today: string) => z.ZodType);

type Parsed<S> = S extends z.ZodType
  ? z.output<S>
  : S extends (today: string) => infer Z
    ? Z extends z.ZodType
      ? z.output<Z>
      : never
    : undefined;

/** Who may call: an action of the permissions table (signed-in staff whose role it lists), or anyone at all. */
export type Allow = Action | "anyone";

export interface RouteSpec<A extends Allow, P extends SchemaFor | undefined, Q extends SchemaFor | undefined, B extends SchemaFor | undefined> {
  allow: A;
  params?: P;
  query?: Q;
  body?: B;
  /** Middleware run after params and query are checked and before the body is (the multipart reader). */
  uses?: RequestHandler[];
  /** The status of a JSON answer (201 for a create); 204 answers with no body, whatever the handler returns. */
  status?: number;
}

export interface RouteInput<A extends Allow, P, Q, B> {
  user: A extends Action ? User : User | null;
  params: Parsed<P>;
  query: Parsed<Q>;
  body: Parsed<B>;
  /** The dealership and its day, read once per request whoever asks first (a schema, the handler). */
  day: () => Promise<DealershipDay>;
  req: Request;
  res: Response;
}

const GUARDS = Symbol.for("forthright.guards");

/** The action a middleware returned by `allow()` checks, or undefined for any other function. */
export function guardInfo(fn: unknown): Allow | undefined {
  return typeof fn === "function" ? ((fn as unknown as Record<symbol, Allow | undefined>)[GUARDS] ?? undefined) : undefined;
}

/** The guard: 401 when nobody is signed in, 403 when the permissions table does not give the action to the role. */
export function allow(action: Allow): RequestHandler {
  const guard: RequestHandler = (_req, res, next) => {
    if (action !== "anyone") {
      const user = res.locals.auth?.user;
      if (!user) throw unauthorized();
      if (!can(user, action)) throw forbidden();
    }
    next();
  };
  Object.defineProperty(guard, GUARDS, { value: action, enumerable: false });
  return guard;
}

const noDay = (): Promise<DealershipDay> => Promise.reject(unauthorized());

const WHAT: Record<Part, string> = { params: "address", query: "query", body: "form" };

function validator(part: Part, schema: SchemaFor): RequestHandler {
  const fixed = typeof schema === "function" ? null : schema;
  const middleware: RequestHandler = async (req, res, next) => {
    const s = fixed ?? (schema as (today: string) => z.ZodType)((await (res.locals.day ?? noDay)()).today);
    parsedOf(res)[part] = parseOr400(s, req[part] ?? {}, WHAT[part]);
    next();
  };
  return tagValidator(middleware, part, schema);
}

const PARSED = Symbol.for("forthright.parsed");
type ParsedParts = Partial<Record<Part, unknown>>;
function parsedOf(res: Response): ParsedParts {
  const holder = res as unknown as Record<symbol, ParsedParts | undefined>;
  return (holder[PARSED] ??= {});
}

/**
 * One route's pipeline as an array of middleware to spread into `router.get(path, ...route(spec, handler))`. The
 * handler's result is sent as JSON (with `spec.status`) unless the handler answered itself (a stream, a 204, a
 * redirect) or returned nothing.
 */
export function route<
  A extends Allow,
  P extends SchemaFor | undefined = undefined,
  Q extends SchemaFor | undefined = undefined,
  B extends SchemaFor | undefined = undefined,
>(
  spec: RouteSpec<A, P, Q, B>,
  handler: (input: RouteInput<A, P, Q, B>) => unknown,
): RequestHandler[] {
  const chain: RequestHandler[] = [allow(spec.allow)];
  if (spec.params) chain.push(validator("params", spec.params));
  if (spec.query) chain.push(validator("query", spec.query));
  if (spec.uses) chain.push(...spec.uses);
  if (spec.body) chain.push(validator("body", spec.body));
  chain.push(async (req: Request, res: Response, _next: NextFunction) => {
    const parsed = parsedOf(res);
    const input = {
      user: res.locals.auth?.user ?? null,
      params: parsed.params,
      query: parsed.query,
      body: parsed.body,
      day: res.locals.day ?? noDay,
      req,
      res,
    } as RouteInput<A, P, Q, B>;
    const result = await handler(input);
    if (res.headersSent) return;
    if (spec.status === 204) res.status(204).end();
    else if (result !== undefined) res.status(spec.status ?? 200).json(result);
  });
  return chain;
}

/**
 * Mounted once under /api after the session is loaded: gives every request a memoised `res.locals.day()` that reads
 * the signed-in user's dealership the first time something asks for it, and never otherwise.
 */
export function dealershipDay(read: (user: User) => Promise<DealershipDay>): RequestHandler {
  return (_req, res, next) => {
    let pending: Promise<DealershipDay> | undefined;
    res.locals.day = () => {
      const user = res.locals.auth?.user;
      if (!user) return noDay();
      return (pending ??= read(user));
    };
    next();
  };
}
