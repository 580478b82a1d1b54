// The authorization matrix: every API route and server action x every role and anonymous,
// with the status the server must answer. Requests for allowed roles carry an invalid body
// where the route changes data, so walking the table proves the gate without changing data
// (the guard runs before validation: 401 -> 404 -> 403 -> 400).
import { ALL_ROLES, type Who } from "../support/roles";

export { ALL_ROLES };
export type Actor = Exclude<Who, "outsider">;
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
  /** The status per actor; absent only on exempt rows. */
  expect?: Record<Actor, number>;
  /** Not walked: why this route is outside the lab guard (e.g. next-auth's own endpoints). */
  exempt?: string;
  note?: string;
  /** The status for a demo-lab machine token with both scopes, when `machineStatus`'s rule does not give it. */
  machine?: number;
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

/**
 * What a machine token of the demo lab (stock:read and stock:write) gets (tokens area): the
 * demo lab's stock routes answer it as they answer a manager; another lab, or a chart or edition
 * that is not the demo lab's, 404; every other route 403 (the public ones too). No session.
 */
export function machineStatus(row: RouteRow, url: string): number {
  if (row.machine !== undefined) return row.machine;
  if (url === "/api/health") return 200;
  const slug = /^\/api\/v1\/labs\/([^/?]+)/.exec(url)?.[1];
  if (slug !== undefined) {
    if (slug !== "demo") return 404;
    return row.route.startsWith("/api/v1/labs/[slug]/stock") ? row.expect!.manager : 403;
  }
  return /^\/api\/v1\/(charts|editions)\/999999999/.test(url) ? 404 : 403;
}

/** Shorthand: the same status for a set of actors, another for the rest. */
export function statuses(allowed: readonly Actor[], ok: number, denied = 403, anonymous = 401): Record<Actor, number> {
  const out = { anonymous } as Record<Actor, number>;
  for (const role of ALL_ROLES) out[role] = allowed.includes(role) ? ok : denied;
  if (allowed.includes("anonymous")) out.anonymous = ok;
  return out;
}

const STOCK = "/api/v1/labs/[slug]/stock";
const demoStock = "/api/v1/labs/demo/stock";
// Writes: managers get 400 (empty body or no file) or 404 (id 0 names no row), so walking the
// table changes nothing.
const stockWrite = (method: HttpMethod, path: string, url: string, body?: unknown): RouteRow => ({
  kind: "route",
  method,
  route: `${STOCK}${path}`,
  url: `${demoStock}${url}`,
  ...(body === undefined ? {} : { body }),
  expect: statuses(["manager"], url.includes("/0") ? 404 : 400),
});

/** Managers 200, other roles 403; the operator's status differs in a lab they are not in (404). */
const managerOnly = (operatorStatus = 403) => ({ ...statuses(["manager"], 200), operator: operatorStatus });
/** Changes walked with a bad body or id: allowed roles get 400, so walking changes nothing. */
const managerBadInput = (operatorStatus = 403) => ({ ...statuses(["manager"], 400), operator: operatorStatus });
/** A malformed id reads as a row that does not exist: 404 for allowed roles, after the role check. */
const managerBadId = (operatorStatus = 403) => ({ ...statuses(["manager"], 404), operator: operatorStatus });
const everyoneSignedIn = (status: number) => statuses(ALL_ROLES, status);

const lab = (slug: string) => `/api/v1/labs/${slug}`;
const NO_LAB = "no-such-lab";
// Seeded ids (tests/e2e/support/db.ts): membership ids as "<lab>:<role>".
const m = (ids: DemoIds, key: string) => String(ids[key]);

export const ROUTES: RouteRow[] = [
  {
    kind: "route",
    method: "GET",
    route: "/api/health",
    url: "/api/health",
    expect: statuses(["anonymous", ...ALL_ROLES], 200),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/auth/[...nextauth]",
    url: "/api/auth/session",
    exempt: "next-auth's own endpoints (csrf, session, providers): public by design, they carry no lab data",
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/auth/[...nextauth]",
    url: "/api/auth/callback/credentials",
    exempt: "next-auth's own sign-in and sign-out endpoints, protected by its CSRF token and the sign-in throttle",
  },

  // members
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/members",
    url: `${lab("demo")}/members`,
    expect: managerOnly(),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/members",
    url: `${lab("demo-north")}/members`,
    expect: managerOnly(404),
    note: "the operator is not in demo-north",
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/members",
    url: `${lab(NO_LAB)}/members`,
    expect: everyoneSignedIn(404),
  },
  {
    kind: "route",
    method: "PATCH",
    route: "/api/v1/labs/[slug]/members/[id]",
    url: (ids) => `${lab("demo")}/members/${m(ids, "demo:operator")}`,
    body: { role: "chief" },
    expect: managerBadInput(),
  },
  {
    kind: "route",
    method: "PATCH",
    route: "/api/v1/labs/[slug]/members/[id]",
    url: (ids) => `${lab("demo-north")}/members/${m(ids, "demo-north:lead")}`,
    body: { role: "chief" },
    expect: managerBadInput(404),
  },
  {
    kind: "route",
    method: "PATCH",
    route: "/api/v1/labs/[slug]/members/[id]",
    url: (ids) => `${lab("demo")}/members/${m(ids, "demo-north:lead")}`,
    body: { role: "lead" },
    expect: statuses(["manager"], 404),
    note: "a membership of another lab is not found through this lab (the body would change nothing)",
  },
  {
    kind: "route",
    method: "DELETE",
    route: "/api/v1/labs/[slug]/members/[id]",
    url: `${lab("demo")}/members/not-a-number`,
    expect: managerBadId(),
  },
  {
    kind: "route",
    method: "DELETE",
    route: "/api/v1/labs/[slug]/members/[id]",
    url: `${lab("demo")}/members/999999999`,
    expect: statuses(["manager"], 404),
  },
  {
    kind: "route",
    method: "DELETE",
    route: "/api/v1/labs/[slug]/members/[id]",
    url: `${lab("demo-north")}/members/not-a-number`,
    expect: managerBadId(404),
  },

  // invitations
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/invitations",
    url: `${lab("demo")}/invitations`,
    expect: managerOnly(),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/invitations",
    url: `${lab("demo-north")}/invitations`,
    expect: managerOnly(404),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/labs/[slug]/invitations",
    url: `${lab("demo")}/invitations`,
    body: { email: "not-an-address", role: "operator" },
    expect: managerBadInput(),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/labs/[slug]/invitations",
    url: `${lab("demo-north")}/invitations`,
    body: { email: "someone@example.test", role: "owner" },
    expect: managerBadInput(404),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/labs/[slug]/invitations",
    url: `${lab(NO_LAB)}/invitations`,
    body: {},
    expect: everyoneSignedIn(404),
  },
  {
    kind: "route",
    method: "DELETE",
    route: "/api/v1/labs/[slug]/invitations/[id]",
    url: `${lab("demo")}/invitations/not-a-number`,
    expect: managerBadId(),
  },
  {
    kind: "route",
    method: "DELETE",
    route: "/api/v1/labs/[slug]/invitations/[id]",
    url: `${lab("demo")}/invitations/999999999`,
    expect: statuses(["manager"], 404),
  },
  {
    kind: "route",
    method: "DELETE",
    route: "/api/v1/labs/[slug]/invitations/[id]",
    url: `${lab("demo-north")}/invitations/999999999`,
    expect: { ...statuses(["manager"], 404), operator: 404 },
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/labs/[slug]/invitations/[id]/resend",
    url: `${lab("demo")}/invitations/0/resend`,
    expect: managerBadId(),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/labs/[slug]/invitations/[id]/resend",
    url: `${lab("demo")}/invitations/999999999/resend`,
    expect: statuses(["manager"], 404),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/labs/[slug]/invitations/[id]/resend",
    url: `${lab("demo-north")}/invitations/999999999/resend`,
    expect: { ...statuses(["manager"], 404), operator: 404 },
  },

  // audit log
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/audit",
    url: `${lab("demo")}/audit`,
    expect: managerOnly(),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/audit",
    url: `${lab("demo")}/audit?limit=0`,
    expect: managerBadInput(),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/audit",
    url: `${lab("demo-north")}/audit`,
    expect: managerOnly(404),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/audit",
    url: `${lab(NO_LAB)}/audit`,
    expect: everyoneSignedIn(404),
  },

  // the lab's rules: every member reads them, only the medical lead changes them
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/rules",
    url: `${lab("demo")}/rules`,
    expect: everyoneSignedIn(200),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/rules",
    url: `${lab(NO_LAB)}/rules`,
    expect: everyoneSignedIn(404),
  },
  {
    kind: "route",
    method: "PUT",
    route: "/api/v1/labs/[slug]/rules",
    url: `${lab("demo")}/rules`,
    body: { managersMayApprove: true, approvers: "everyone" },
    expect: statuses(["lead"], 400),
    note: "an unknown key: refused whole, nothing changes",
  },
  {
    kind: "route",
    method: "PUT",
    route: "/api/v1/labs/[slug]/rules",
    url: `${lab("demo-north")}/rules`,
    body: { reviewPeriodMonths: 0 },
    expect: { ...statuses(["lead"], 400), operator: 404 },
    note: "the operator is not in demo-north",
  },

  // charts and editions (seeded demo ids; allowed roles get a bad body or a conflict, so nothing changes)
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/charts",
    url: `${lab("demo")}/charts`,
    expect: everyoneSignedIn(200),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/charts",
    url: `${lab("demo-north")}/charts`,
    expect: { ...everyoneSignedIn(200), operator: 404 },
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/labs/[slug]/charts",
    url: `${lab("demo")}/charts`,
    body: { title: "" },
    expect: statuses(["manager", "educator"], 400),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/charts/[id]",
    url: (ids) => `/api/v1/charts/${ids["chart:pot"]}`,
    expect: everyoneSignedIn(200),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/charts/[id]",
    url: "/api/v1/charts/999999999",
    expect: everyoneSignedIn(404),
  },
  {
    kind: "route",
    method: "PATCH",
    route: "/api/v1/charts/[id]",
    url: (ids) => `/api/v1/charts/${ids["chart:pot"]}`,
    body: { paper: "B5" },
    expect: statuses(["manager", "educator"], 400),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/charts/[id]/grid",
    url: (ids) => `/api/v1/charts/${ids["chart:pot"]}/grid`,
    expect: everyoneSignedIn(200),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/charts/[id]/grid",
    url: "/api/v1/charts/999999999/grid",
    expect: everyoneSignedIn(404),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/editions/[id]/grid",
    url: (ids) => `/api/v1/editions/${ids["edition:pot"]}/grid`,
    expect: everyoneSignedIn(200),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/charts/[id]/logo",
    url: (ids) => `/api/v1/charts/${ids["chart:pot"]}/logo`,
    expect: everyoneSignedIn(404),
    note: "the demo chart has no logo",
  },
  {
    kind: "route",
    method: "PUT",
    route: "/api/v1/charts/[id]/logo",
    url: (ids) => `/api/v1/charts/${ids["chart:pot"]}/logo`,
    body: {},
    expect: statuses(["manager", "educator"], 400),
    note: "not multipart",
  },
  {
    kind: "route",
    method: "DELETE",
    route: "/api/v1/charts/[id]/logo",
    url: (ids) => `/api/v1/charts/${ids["chart:pot"]}/logo`,
    expect: statuses(["manager", "educator"], 409),
    note: "no logo to remove: nothing changes",
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/charts/[id]/editions",
    url: (ids) => `/api/v1/charts/${ids["chart:pot"]}/editions`,
    body: { draft: false },
    expect: statuses(["manager", "educator"], 400),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/editions/[id]/approve",
    url: (ids) => `/api/v1/editions/${ids["edition:pot"]}/approve`,
    body: { reviewed: true },
    expect: statuses(["lead"], 409),
    note: "already approved: a conflict that changes nothing; managers only where the lab's rules grant it",
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/editions/[id]/approve",
    url: (ids) => `/api/v1/editions/${ids["edition:draft"]}/approve`,
    expect: statuses(["lead"], 400),
    note: "no statement of review: 400 naming reviewed",
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/editions/[id]/reject",
    url: (ids) => `/api/v1/editions/${ids["edition:draft"]}/reject`,
    body: {},
    expect: statuses(["lead"], 400),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/editions/[id]/withdraw",
    url: (ids) => `/api/v1/editions/${ids["edition:pot"]}/withdraw`,
    body: { reason: 5 },
    expect: statuses(["manager"], 400),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/editions/[id]/withdraw",
    url: "/api/v1/editions/999999999/withdraw",
    body: {},
    expect: everyoneSignedIn(404),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/editions/[id]/pdf",
    url: (ids) => `/api/v1/editions/${ids["edition:pot"]}/pdf`,
    expect: everyoneSignedIn(200),
    note: "every download is audited (edition.downloaded)",
  },
  // posters: the PDF's variants (tiles, badge card, archive copy); each is the same route.
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/editions/[id]/pdf",
    url: (ids) => `/api/v1/editions/${ids["edition:pot"]}/pdf?tiles=B5`,
    expect: everyoneSignedIn(400),
    note: "posters: tiles takes A4, A3, LETTER or TABLOID only (400 naming tiles)",
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/editions/[id]/pdf",
    url: (ids) => `/api/v1/editions/${ids["edition:pot"]}/pdf?format=zip`,
    expect: everyoneSignedIn(400),
    note: "posters: format takes poster or card only (400 naming format)",
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/editions/[id]/pdf",
    url: (ids) => `/api/v1/editions/${ids["edition:pot"]}/pdf?copy=archive`,
    expect: statuses(["manager"], 200),
    note: "posters: the archive copy is for managers only, audited as edition.archive_copy",
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/editions/[id]/postings",
    url: (ids) => `/api/v1/editions/${ids["edition:pot"]}/postings`,
    body: { roomId: "x" },
    expect: everyoneSignedIn(404),
    note: "a malformed room id names no room: 404, like a room of another lab",
  },

  // rooms, postings and the public check
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/rooms",
    url: `${lab("demo")}/rooms`,
    expect: everyoneSignedIn(200),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/labs/[slug]/rooms",
    url: `${lab("demo")}/rooms`,
    body: { name: "" },
    expect: statuses(["manager"], 400),
  },
  {
    kind: "route",
    method: "PATCH",
    route: "/api/v1/labs/[slug]/rooms/[id]",
    url: (ids) => `${lab("demo")}/rooms/${ids["room:1"]}`,
    body: { name: "" },
    expect: statuses(["manager"], 400),
  },
  {
    kind: "route",
    method: "DELETE",
    route: "/api/v1/labs/[slug]/rooms/[id]",
    url: `${lab("demo")}/rooms/999999999`,
    expect: statuses(["manager"], 404),
  },
  {
    kind: "route",
    method: "DELETE",
    route: "/api/v1/labs/[slug]/postings/[id]",
    url: `${lab("demo")}/postings/999999999`,
    expect: everyoneSignedIn(404),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/check/[token]",
    url: (ids) => `/api/v1/check/${ids["token:pot"]}`,
    expect: statuses(["anonymous", ...ALL_ROLES], 200),
    note: "public: what the poster's QR code opens",
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/check/[token]",
    url: "/api/v1/check/AAAAAAAAAAAAAAAAAAAAAAAA",
    expect: statuses(["anonymous", ...ALL_ROLES], 404),
  },

  // phone: the check page and the short code, plain HTML route handlers (public, rate-limited per address)
  {
    kind: "route",
    method: "GET",
    route: "/v/[token]",
    url: (ids) => `/v/${ids["token:pot"]}`,
    expect: statuses(["anonymous"], 200, 303),
    machine: 200,
    note: "public; a member of the edition's lab goes on (303) to /v/<token>/lab with rooms and printing; a token is no one",
  },
  {
    kind: "route",
    method: "GET",
    route: "/v/[token]",
    url: "/v/AAAAAAAAAAAAAAAAAAAAAAAA",
    expect: statuses(["anonymous", ...ALL_ROLES], 404),
    machine: 404,
  },
  {
    kind: "route",
    method: "GET",
    route: "/c/[code]",
    url: (ids) => `/c/${ids["code:pot"]}`,
    expect: statuses(["anonymous", ...ALL_ROLES], 303),
    machine: 303,
    note: "public: redirects to /v/<token>",
  },
  {
    kind: "route",
    method: "GET",
    route: "/c/[code]",
    url: "/c/0000-0000",
    expect: statuses(["anonymous", ...ALL_ROLES], 404),
    machine: 404,
  },
  {
    kind: "route",
    method: "GET",
    route: "/c",
    url: "/c?code=0000-0000",
    expect: statuses(["anonymous", ...ALL_ROLES], 404),
    machine: 404,
    note: "public: the code typed again on the 'No printout has this code' page; a known code redirects like /c/<code>",
  },

  // phone: the calculator's lab data (loaded once) and the header's account part (prerendered pages)
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/calculator",
    url: "/api/v1/calculator",
    expect: statuses(ALL_ROLES, 200),
    note: "only the caller's own labs",
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/header",
    url: "/api/v1/header",
    expect: statuses(["anonymous", ...ALL_ROLES], 200),
    note: "anonymous: nobody",
  },

  // public sizing
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/solve",
    url: "/api/v1/solve?law=murray&mb=3&sb=2",
    expect: statuses(["anonymous", ...ALL_ROLES], 200),
    note: "public: holds no lab data",
  },

  // stock
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
  { ...stockWrite("POST", "/impact", "/impact", {}), note: "names no change: 400 for managers; never writes" },

  // onboard: sign-up and new labs
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/accounts",
    url: "/api/v1/accounts",
    body: {},
    expect: statuses(["anonymous", ...ALL_ROLES], 400),
    note: "public sign-up (SIGNUP=open): 202 for any valid body, existing address or not; 403 when invite-only",
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/labs",
    url: "/api/v1/labs",
    body: {},
    expect: everyoneSignedIn(400),
    note: "any signed-in person with a confirmed address; the creator becomes the lab's manager",
  },

  // ---- tokens area: lab settings and machine tokens ----
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/settings",
    url: `${lab("demo")}/settings`,
    expect: everyoneSignedIn(200),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/settings",
    url: `${lab(NO_LAB)}/settings`,
    expect: everyoneSignedIn(404),
  },
  {
    kind: "route",
    method: "PATCH",
    route: "/api/v1/labs/[slug]/settings",
    url: `${lab("demo")}/settings`,
    body: { timeZone: "Nowhere/Nothing" },
    expect: managerBadInput(),
    note: "not an IANA name: refused whole, nothing changes",
  },
  {
    kind: "route",
    method: "PATCH",
    route: "/api/v1/labs/[slug]/settings",
    url: `${lab("demo-north")}/settings`,
    body: { isDemo: false },
    expect: managerBadInput(404),
    note: "the demo flag is the seed's; the operator is not in demo-north",
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/tokens",
    url: `${lab("demo")}/tokens`,
    expect: managerOnly(),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/labs/[slug]/tokens",
    url: `${lab("demo")}/tokens`,
    body: { name: "", scopes: [] },
    expect: managerBadInput(),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/labs/[slug]/tokens",
    url: `${lab("demo-north")}/tokens`,
    body: { name: "walker", scopes: ["stock:admin"] },
    expect: managerBadInput(404),
    note: "the operator is not in demo-north",
  },
  {
    kind: "route",
    method: "DELETE",
    route: "/api/v1/labs/[slug]/tokens/[id]",
    url: `${lab("demo")}/tokens/0`,
    expect: managerBadId(),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/labs/[slug]/tokens/[id]/reissue",
    url: `${lab("demo")}/tokens/0/reissue`,
    expect: managerBadId(),
  },

  // area signoff: edition diff, chart archive
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/editions/[id]/diff",
    url: (ids) => `/api/v1/editions/${ids["edition:pot"]}/diff`,
    expect: everyoneSignedIn(200),
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/editions/[id]/diff",
    url: "/api/v1/editions/999999999/diff",
    expect: everyoneSignedIn(404),
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/charts/[id]/archive",
    url: (ids) => `/api/v1/charts/${ids["chart:pot"]}/archive`,
    body: { confirm: "yes" },
    expect: statuses(["manager", "lead"], 400),
    note: "an unknown key is refused (400) after the role check, so walking archives nothing",
  },
  {
    kind: "route",
    method: "POST",
    route: "/api/v1/charts/[id]/restore",
    url: (ids) => `/api/v1/charts/${ids["chart:pot"]}/restore`,
    body: { confirm: "yes" },
    expect: statuses(["manager", "lead"], 400),
    note: "an unknown key is refused (400) after the role check, so walking restores nothing",
  },
  {
    kind: "route",
    method: "GET",
    route: "/api/v1/labs/[slug]/charts",
    url: `${lab("demo")}/charts?archived=1`,
    expect: everyoneSignedIn(200),
    note: "the archived charts",
  },
];

const ANYONE = ["anonymous", ...ALL_ROLES] as const;
const MEMBERS_ACTIONS = "app/(lab)/labs/[slug]/members/actions.ts";
const CHART_ACTIONS = "app/(lab)/labs/[slug]/charts/actions.ts";
const ROOM_ACTIONS = "app/(lab)/labs/[slug]/rooms/actions.ts";
const CHECK_ACTIONS = "app/(public)/v/[token]/actions.ts";
const LAB_ACTIONS = "app/(lab)/labs/[slug]/actions.ts";
const STOCK_ACTIONS = "app/(lab)/labs/[slug]/stock/actions.ts";
const AUTH_ACTIONS = "lib/auth/actions.ts";
const SIGN_UP_ACTIONS = "lib/auth/sign-up-actions.ts";
const NEW_LAB_ACTIONS = "app/(lab)/labs/new/actions.ts";
const ACCOUNT_ACTIONS = "app/(lab)/account/actions.ts";
const SETTINGS_ACTIONS = "app/(lab)/labs/[slug]/settings/actions.ts";

export const ACTIONS: ActionRow[] = [
  {
    kind: "action",
    file: AUTH_ACTIONS,
    name: "signInAction",
    allowed: ANYONE,
    note: "checks the password under the sign-in throttle",
  },
  {
    kind: "action",
    file: AUTH_ACTIONS,
    name: "signOutAction",
    allowed: ANYONE,
    note: "ends the caller's own session only",
  },
  {
    kind: "action",
    file: AUTH_ACTIONS,
    name: "requestPasswordResetAction",
    allowed: ANYONE,
    note: "same answer for every address; at most 5 e-mails per address per hour",
  },
  {
    kind: "action",
    file: AUTH_ACTIONS,
    name: "resetPasswordAction",
    allowed: ANYONE,
    note: "the single-use e-mailed token is the credential",
  },
  {
    kind: "action",
    file: AUTH_ACTIONS,
    name: "acceptInvitationAction",
    allowed: ANYONE,
    note: "the single-use e-mailed token is the credential; creates only the invited address's account",
  },
  {
    kind: "action",
    file: AUTH_ACTIONS,
    name: "joinLabAction",
    allowed: ["any-signed-in"],
    note: "and only the account whose address was invited",
  },
  { kind: "action", file: MEMBERS_ACTIONS, name: "inviteMemberAction", allowed: ["manager"] },
  { kind: "action", file: MEMBERS_ACTIONS, name: "resendInvitationAction", allowed: ["manager"] },
  { kind: "action", file: MEMBERS_ACTIONS, name: "revokeInvitationAction", allowed: ["manager"] },
  { kind: "action", file: MEMBERS_ACTIONS, name: "changeMemberRoleAction", allowed: ["manager"] },
  { kind: "action", file: MEMBERS_ACTIONS, name: "removeMemberAction", allowed: ["manager"] },
  { kind: "action", file: CHART_ACTIONS, name: "saveChartAction", allowed: ["manager", "educator"] },
  { kind: "action", file: CHART_ACTIONS, name: "createEditionAction", allowed: ["manager", "educator"] },
  {
    kind: "action",
    file: CHART_ACTIONS,
    name: "approveEditionAction",
    allowed: ["lead"],
    note: "managers only where the lab's rules grant it; never by anyone who changed the chart since its last approval",
  },
  { kind: "action", file: CHART_ACTIONS, name: "rejectEditionAction", allowed: ["lead"] },
  { kind: "action", file: CHART_ACTIONS, name: "withdrawEditionAction", allowed: ["manager"] },
  { kind: "action", file: CHART_ACTIONS, name: "setChartLogoAction", allowed: ["manager", "educator"] },
  { kind: "action", file: CHART_ACTIONS, name: "removeChartLogoAction", allowed: ["manager", "educator"] },
  // area signoff: archive a chart
  { kind: "action", file: CHART_ACTIONS, name: "archiveChartAction", allowed: ["manager", "lead"] },
  { kind: "action", file: CHART_ACTIONS, name: "restoreChartAction", allowed: ["manager", "lead"] },
  ...[
    "saveFamilyAction",
    "saveBalloonAction",
    "savePlatformAction",
    "saveSizeAction",
    "deleteFamilyAction",
    "deleteBalloonAction",
    "deletePlatformAction",
    "deleteSizeAction",
    "importStockAction",
    "stockImpactAction",
  ].map((name): ActionRow => ({ kind: "action", file: STOCK_ACTIONS, name, allowed: ["manager"] })),
  { kind: "action", file: ROOM_ACTIONS, name: "createRoomAction", allowed: ["manager"] },
  { kind: "action", file: ROOM_ACTIONS, name: "renameRoomAction", allowed: ["manager"] },
  { kind: "action", file: ROOM_ACTIONS, name: "archiveRoomAction", allowed: ["manager"] },
  { kind: "action", file: ROOM_ACTIONS, name: "takeDownAction", allowed: ALL_ROLES },
  { kind: "action", file: ROOM_ACTIONS, name: "restorePostingAction", allowed: ALL_ROLES },
  {
    kind: "action",
    file: CHECK_ACTIONS,
    name: "recordPostingAction",
    allowed: ALL_ROLES,
    note: "members of the edition's own lab",
  },
  // onboard: sign-up, the account page, new labs
  {
    kind: "action",
    file: SIGN_UP_ACTIONS,
    name: "signUpAction",
    allowed: ANYONE,
    note: "same answer for every address; 10 sign-ups per client address per hour; refused when invite-only",
  },
  {
    kind: "action",
    file: SIGN_UP_ACTIONS,
    name: "verifyEmailAction",
    allowed: ANYONE,
    note: "the single-use e-mailed token is the credential",
  },
  {
    kind: "action",
    file: SIGN_UP_ACTIONS,
    name: "resendVerificationAction",
    allowed: ["any-signed-in"],
    note: "only for the caller's own unconfirmed address; 5 e-mails per address per hour",
  },
  {
    kind: "action",
    file: NEW_LAB_ACTIONS,
    name: "createLabAction",
    allowed: ["any-signed-in"],
    note: "needs a confirmed address",
  },
  ...["changeNameAction", "changeEmailAction", "changePasswordAction"].map((name): ActionRow => ({
    kind: "action",
    file: ACCOUNT_ACTIONS,
    name,
    allowed: ["any-signed-in"],
    note: "the caller's own account; e-mail and password need the current password",
  })),
  {
    kind: "action",
    file: "app/(lab)/labs/[slug]/stock/ladder/actions.ts",
    name: "createLadderFamilyAction",
    allowed: ["manager"],
    note: "the first-run size ladder; the pressures are the manager's own",
  },
  {
    kind: "action",
    file: ACCOUNT_ACTIONS,
    name: "leaveLabAction",
    allowed: ALL_ROLES,
    note: "members leave their own membership; never the lab's last manager",
  },
  {
    kind: "action",
    file: CHECK_ACTIONS,
    name: "takeDownPostingAction",
    allowed: ALL_ROLES,
    note: "members of the edition's own lab",
  },
  // ---- tokens area: lab settings and machine tokens ----
  { kind: "action", file: SETTINGS_ACTIONS, name: "updateLabSettingsAction", allowed: ["manager"] },
  { kind: "action", file: SETTINGS_ACTIONS, name: "createTokenAction", allowed: ["manager"] },
  { kind: "action", file: SETTINGS_ACTIONS, name: "revokeTokenAction", allowed: ["manager"] },
  { kind: "action", file: SETTINGS_ACTIONS, name: "reissueTokenAction", allowed: ["manager"] },
  {
    kind: "action",
    file: LAB_ACTIONS,
    name: "setStaleMailAction",
    allowed: ALL_ROLES,
    note: "changes only the caller's own membership",
  },
  // rules area: the rules page's save (the lab rules API rows are with the routes above)
  {
    kind: "action",
    file: "app/(lab)/labs/[slug]/rules/actions.ts",
    name: "saveLabRulesAction",
    allowed: ["lead"],
    note: "the medical lead only; audited",
  },
  {
    kind: "action",
    file: "app/(lab)/labs/[slug]/rules/actions.ts",
    name: "rulesImpactAction",
    allowed: ["lead"],
    note: "the medical lead only; writes nothing",
  },
];
