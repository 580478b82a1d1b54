import { and, eq, like } from "drizzle-orm";
import mysql from "mysql2";
import { afterAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, rateLimits } from "@/db/schema";
import { databaseName, verifySignIn } from "@/lib/auth/sign-in";
import { accountKey, createSignInThrottle } from "@/lib/auth/throttle";
import { env } from "@/lib/env";
import { createUser, FIXTURE_PASSWORD } from "./support/fixtures";

// A second, separate connection pool stands for a second app instance.
const otherInstancePool = mysql.createPool({ uri: env.DATABASE_URL, connectionLimit: 2 });
afterAll(async () => {
  await new Promise((r) => otherInstancePool.end(r));
  await pool.end();
});

const throttle = (windowSeconds = 60, p = pool.pool, maxFailsPerAccount = 3) =>
  createSignInThrottle({
    pool: p,
    dbName: databaseName(env.DATABASE_URL),
    maxFailsPerAccount,
    maxFailsPerIp: 6,
    windowSeconds,
  });
let ipSeq = 0;
// Documentation-range addresses, a new one per call, so tests never share an address counter.
const freshIp = () =>
  `2001:db8:${process.pid.toString(16)}:${Date.now().toString(16).slice(-4)}::${(++ipSeq).toString(16)}`;

describe("sign-in throttle (rate-limiter-flexible on MariaDB)", () => {
  it("wrong passwords never sign in; after the limit even the right password is refused; success clears the count", async () => {
    const user = await createUser("throttled");
    const t = throttle();
    const ip = freshIp();
    for (let i = 0; i < 3; i++)
      expect(await verifySignIn({ email: user.email, password: `wrong-${i}`, ip, throttle: t })).toEqual({
        ok: false,
        reason: "invalid",
      });
    const refused = await verifySignIn({ email: user.email, password: FIXTURE_PASSWORD, ip, throttle: t });
    expect(refused).toMatchObject({ ok: false, reason: "throttled" });
    // Case and spaces do not open a second counter.
    expect(
      await verifySignIn({ email: ` ${user.email.toUpperCase()} `, password: FIXTURE_PASSWORD, ip, throttle: t }),
    ).toMatchObject({ reason: "throttled" });

    const [row] = await db
      .select()
      .from(rateLimits)
      .where(eq(rateLimits.key, `signin-account:${accountKey(user.email)}`));
    expect(row!.points).toBeGreaterThanOrEqual(3);
    expect(JSON.stringify(row)).not.toContain(user.email);

    const failed = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.targetId, String(user.id)), like(auditEvents.action, "signin.%")));
    expect(failed.map((e) => e.action)).toEqual([
      "signin.failed",
      "signin.failed",
      "signin.failed",
      "signin.refused",
      "signin.refused",
    ]);
    expect(JSON.stringify(failed)).not.toMatch(/wrong-|fixture-password/);
  });

  it("slows answers as failures add up, and releases after the window", async () => {
    const user = await createUser("released");
    // Five allowed: the answers wait 0, 0, 250, 500 and 1000 ms (lib/auth/throttle-policy.ts).
    // The waits are recorded, not slept, and the window's end is reached by moving the clock
    // that rate-limiter-flexible reads (Date), so nothing here depends on the machine's speed.
    const t = throttle(8, pool.pool, 5);
    const ip = freshIp();
    const waits: number[] = [];
    const sleep = async (ms: number) => {
      waits.push(ms);
    };
    for (let i = 0; i < 5; i++) {
      const before = waits.length;
      await verifySignIn({ email: user.email, password: "wrong-password", ip, throttle: t, sleep });
      if (waits.length === before) waits.push(0);
    }
    expect(waits).toEqual([0, 0, 250, 500, 1000]);
    expect(await verifySignIn({ email: user.email, password: FIXTURE_PASSWORD, ip, throttle: t, sleep })).toMatchObject(
      { reason: "throttled" },
    );
    const [row] = await db
      .select()
      .from(rateLimits)
      .where(eq(rateLimits.key, `signin-account:${accountKey(user.email)}`));
    const wait = Number(row!.expire) - Date.now();
    expect(wait).toBeGreaterThan(5000);
    expect(wait).toBeLessThanOrEqual(8000);
    vi.useFakeTimers({ toFake: ["Date"], now: Number(row!.expire) + 100 });
    try {
      const ok = await verifySignIn({ email: user.email, password: FIXTURE_PASSWORD, ip, throttle: t, sleep });
      expect(ok).toMatchObject({ ok: true, user: { id: user.id } });
    } finally {
      vi.useRealTimers();
    }
    expect(
      await db
        .select()
        .from(rateLimits)
        .where(eq(rateLimits.key, `signin-account:${accountKey(user.email)}`)),
    ).toEqual([]);
  });

  it("counts one client address across accounts, and a success does not clear the address", async () => {
    const t = throttle();
    const ip = freshIp();
    const good = await createUser("bystander");
    for (let i = 0; i < 6; i++)
      await verifySignIn({ email: `nobody-${i}-${ip}@example.test`, password: "guess", ip, throttle: t });
    expect(await verifySignIn({ email: good.email, password: FIXTURE_PASSWORD, ip, throttle: t })).toMatchObject({
      reason: "throttled",
    });
    expect(
      await verifySignIn({ email: good.email, password: FIXTURE_PASSWORD, ip: freshIp(), throttle: t }),
    ).toMatchObject({ ok: true });
  });

  it("holds across app instances: failures seen through one pool refuse through another", async () => {
    const user = await createUser("two-instances");
    const ip = freshIp();
    const a = throttle(60, pool.pool);
    const b = throttle(60, otherInstancePool);
    for (let i = 0; i < 3; i++)
      await verifySignIn({ email: user.email, password: `wrong-${i}`, ip, throttle: i % 2 ? a : b });
    expect(await verifySignIn({ email: user.email, password: FIXTURE_PASSWORD, ip, throttle: a })).toMatchObject({
      reason: "throttled",
    });
    expect(await verifySignIn({ email: user.email, password: FIXTURE_PASSWORD, ip, throttle: b })).toMatchObject({
      reason: "throttled",
    });
  });

  it("an unknown address is answered like a wrong password", async () => {
    const res = await verifySignIn({
      email: "never-registered@example.test",
      password: "whatever-1",
      ip: freshIp(),
      throttle: throttle(),
    });
    expect(res).toEqual({ ok: false, reason: "invalid" });
  });
});
