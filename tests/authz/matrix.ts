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

const STOCK = "/api/v1/labs/[slug]/stock";
const demoStock = "/api/v1/labs/demo/stock";
// Writes: managers get 400 (empty body, id 0 or no file), so walking the table changes nothing.
const stockWrite = (method: HttpMethod, path: string, url: string, body?: unknown): RouteRow => ({
  kind: "route",
  method,
  route: `${STOCK}${path}`,
  url: `${demoStock}${url}`,
  ...(body === undefined ? {} : { body }),
  expect: statuses(["manager"], 400),
});

export const ROUTES: RouteRow[] = [
  { kind: "route", method: "GET", route: "/api/health", url: "/api/health", expect: statuses(["anonymous", ...ALL_ROLES], 200) },
  { kind: "route", method: "GET", route: "/api/v1/solve", url: "/api/v1/solve?law=murray&mb=3&sb=2", expect: statuses(["anonymous", ...ALL_ROLES], 200), note: "public: holds no lab data" },
  { kind: "route", method: "GET", route: STOCK, url: demoStock, expect: statuses(ALL_ROLES, 200) },
  stockWrite("POST", "/families", "/families", {}),
  stockWrite("PATCH", "/families/[id]", "/families/0", {}),
  stockWrite("DELETE", "/families/[id]", "/families/0"),
  stockWrite("POST", "/families/[id]/balloons", "/families/0/balloons", {}),
  stockWrite("PATCH", "/balloons/[id]", "/balloons/0", {}),
  stockWrite("DELETE", "/balloons/[id]", "/balloons/0"),
  stockWrite("POST", "/platforms", "/platforms", {}),
  stockWrite("PATCH", "/platforms/[id]", "/platforms/0", {}),
  stockWrite("DELETE", "/platforms/[id]", "/platforms/0"),
  stockWrite("POST", "/platforms/[id]/sizes", "/platforms/0/sizes", {}),
  stockWrite("PATCH", "/sizes/[id]", "/sizes/0", {}),
  stockWrite("DELETE", "/sizes/[id]", "/sizes/0"),
  { ...stockWrite("POST", "/import", "/import?dryRun=1"), note: "no multipart body: 400 for managers" },
];

export const ACTIONS: ActionRow[] = [];
