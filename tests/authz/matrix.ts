// The authorization matrix: every API route and server action x every role and anonymous,
// with the status the server must answer. Requests for allowed roles carry an invalid body
// where the route changes data, so walking the table proves the gate without changing data
// (the guard runs before validation: 401 -> 404 -> 403 -> 400).
import type { Role } from "@/lib/permissions";

export type Actor = "anonymous" | Role;
export type HttpMethod = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";

/** Ids of seeded demo rows that concrete URLs may need, looked up once by the walker. */
export type DemoIds = Record<string, number | string>;

export type RouteRow = {
  kind: "route";
  method: HttpMethod;
  /** The route as laid out under app/, e.g. "/api/v1/labs/[slug]/stock". */
  route: string;
  /** The concrete request; a function when it needs seeded ids. */
  url: string | ((ids: DemoIds) => string);
  body?: unknown;
  expect: Record<Actor, number>;
  note?: string;
};

export type ActionRow = {
  kind: "action";
  /** file under app/ or lib/ that declares "use server", and the exported function name */
  file: string;
  name: string;
  /** who may run it; everyone else is refused on the server */
  allowed: readonly (Actor | "any-signed-in")[];
  note?: string;
};

export const ALL_ROLES: readonly Role[] = ["manager", "lead", "educator", "operator"];

/** Shorthand: the same status for a set of actors, another for the rest. */
export function statuses(allowed: readonly Actor[], ok: number, denied = 403, anonymous = 401): Record<Actor, number> {
  const out = { anonymous } as Record<Actor, number>;
  for (const role of ALL_ROLES) out[role] = allowed.includes(role) ? ok : denied;
  if (allowed.includes("anonymous")) out.anonymous = ok;
  return out;
}

export const ROUTES: RouteRow[] = [
  { kind: "route", method: "GET", route: "/api/health", url: "/api/health", expect: statuses(["anonymous", ...ALL_ROLES], 200) },
  { kind: "route", method: "GET", route: "/api/v1/solve", url: "/api/v1/solve?law=murray&mb=3&sb=2", expect: statuses(["anonymous", ...ALL_ROLES], 200), note: "public: holds no lab data" },
];

export const ACTIONS: ActionRow[] = [];
