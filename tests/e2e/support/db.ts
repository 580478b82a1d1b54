// Direct reads and fixtures for the browser tests, on the test database the runner exported
// (no app endpoint involved).
import { createHash, randomBytes } from "node:crypto";
import bcrypt from "bcryptjs";
import mysql from "mysql2/promise";
import { loadLocalEnv } from "../../../db/local-env";

loadLocalEnv();

let pool: mysql.Pool | undefined;
function db(): mysql.Pool {
  if (!process.env.DB_NAME?.endsWith("_test"))
    throw new Error("browser tests expect the *_test database that npm test provisions");
  pool ??= mysql.createPool({
    host: process.env.DB_HOST ?? "127.0.0.1",
    port: Number(process.env.DB_PORT ?? 3307),
    user: process.env.DB_USER ?? "forkwall",
    password: process.env.DB_PASSWORD,
    database: process.env.DB_NAME,
    connectionLimit: 2,
    timezone: "Z",
  });
  return pool;
}

export async function query<T = Record<string, unknown>>(sql: string, params: unknown[] = []): Promise<T[]> {
  const [rows] = await db().query(sql, params);
  return rows as T[];
}

export async function closeDb() {
  await pool?.end();
  pool = undefined;
}

/**
 * Seeded ids: memberships keyed "<lab slug>:<role>" (e.g. "demo-north:lead"), and the demo lab's
 * POT chart ("chart:pot"), its approved edition ("edition:pot", check token "token:pot"), the
 * draft edition ("edition:draft") and "room:1" (Procedure room 1). Another `slug` (with the
 * e-mail pattern of its people) reads the same rows of a lab seeded like the demo lab.
 */
export async function demoIds(slug = "demo", emailLike = "%@forkwall.test"): Promise<Record<string, number | string>> {
  const rows = await query<{ slug: string; role: string; id: number }>(
    "SELECT l.slug, m.role, m.id FROM memberships m JOIN labs l ON l.id = m.lab_id JOIN users u ON u.id = m.user_id WHERE (l.slug = ? AND u.email LIKE ?) OR (l.slug = 'demo-north' AND u.email LIKE '%@forkwall.test')",
    [slug, emailLike],
  );
  const ids: Record<string, number | string> = Object.fromEntries(
    rows.map((r) => [`${r.slug}:${r.role}`, Number(r.id)]),
  );
  const [pot] = await query<{ chart: number; edition: number; token: string; code: string }>(
    "SELECT c.id AS chart, e.id AS edition, e.check_token AS token, e.short_code AS code FROM charts c JOIN labs l ON l.id = c.lab_id JOIN editions e ON e.chart_id = c.id WHERE l.slug = ? AND c.title = 'POT balloon chart (demo)' AND e.status = 'approved'",
    [slug],
  );
  const [draft] = await query<{ id: number }>(
    "SELECT e.id FROM editions e JOIN labs l ON l.id = e.lab_id WHERE l.slug = ? AND e.status = 'draft' ORDER BY e.id LIMIT 1",
    [slug],
  );
  const [room] = await query<{ id: number }>(
    "SELECT r.id FROM rooms r JOIN labs l ON l.id = r.lab_id WHERE l.slug = ? AND r.name = 'Procedure room 1'",
    [slug],
  );
  if (pot)
    Object.assign(ids, {
      "chart:pot": Number(pot.chart),
      "edition:pot": Number(pot.edition),
      "token:pot": pot.token,
      "code:pot": pot.code,
    });
  if (draft) ids["edition:draft"] = Number(draft.id);
  if (room) ids["room:1"] = Number(room.id);
  return ids;
}

export const uniqueEmail = (prefix: string) =>
  `${prefix}-${Date.now().toString(36)}${randomBytes(3).toString("hex")}@example.test`;

/** A person with a known password, optionally a member of a demo lab. */
export async function createPerson(opts: { prefix: string; password: string; lab?: string; role?: string }) {
  const email = uniqueEmail(opts.prefix);
  const name = `E2E ${opts.prefix}`;
  await query("INSERT INTO users (email, name, password_hash) VALUES (?, ?, ?)", [
    email,
    name,
    await bcrypt.hash(opts.password, 10),
  ]);
  const [user] = await query<{ id: number }>("SELECT id FROM users WHERE email = ?", [email]);
  let membershipId: number | undefined;
  if (opts.lab) {
    await query("INSERT INTO memberships (lab_id, user_id, role) SELECT id, ?, ? FROM labs WHERE slug = ?", [
      user!.id,
      opts.role ?? "operator",
      opts.lab,
    ]);
    const [m] = await query<{ id: number }>(
      "SELECT m.id FROM memberships m JOIN labs l ON l.id = m.lab_id WHERE l.slug = ? AND m.user_id = ?",
      [opts.lab, user!.id],
    );
    membershipId = Number(m!.id);
  }
  return { id: Number(user!.id), email, name, membershipId };
}

export const throttleKey = (email: string) =>
  `signin-account:${createHash("sha256").update(email.trim().toLowerCase()).digest("hex")}`;

/** Moves a throttle window's end into the past, as if its minutes had gone by. */
export async function expireThrottle(email: string) {
  await query("UPDATE rate_limits SET expire = ? WHERE `key` = ?", [Date.now() - 1, throttleKey(email)]);
}
