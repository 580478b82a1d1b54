import { Writable } from "node:stream";
import { afterEach, describe, expect, it, vi } from "vitest";
import { AppError, isDatabaseUnreachable, toAppError } from "@/lib/errors";
import { errorResponse as respond } from "@/lib/http/respond";
import type { Logger } from "@/lib/log";

const errorResponse = (err: unknown, logger: Logger) => respond(err, {}, logger);
import { createLogger, logFor } from "@/lib/log";

function capture() {
  const lines: Record<string, unknown>[] = [];
  const destination = new Writable({
    write(chunk, _enc, done) {
      for (const line of String(chunk).split("\n")) if (line.trim()) lines.push(JSON.parse(line));
      done();
    },
  });
  return { lines, destination };
}

describe("lib/log", () => {
  it("censors passwords, tokens, cookies and secrets at the top, one level down and in headers", () => {
    const { lines, destination } = capture();
    const logger = createLogger({ level: "info", destination });
    logger.info(
      {
        password: "hunter2-plain",
        token: "tok-abc",
        body: { newPassword: "s3cret-new", email: "a@example.test", tokenHash: "deadbeef" },
        req: { headers: { cookie: "authjs.session-token=xyz", authorization: "Bearer abc", accept: "text/html" } },
        AUTH_SECRET: "x".repeat(40),
      },
      "sign-in",
    );
    const raw = JSON.stringify(lines);
    for (const secret of [
      "hunter2-plain",
      "tok-abc",
      "s3cret-new",
      "deadbeef",
      "session-token=xyz",
      "Bearer abc",
      "xxxxxxxx",
    ])
      expect(raw).not.toContain(secret);
    const line = lines[0] as { body: { email: string }; req: { headers: { accept: string; cookie: string } } };
    expect(line.body.email).toBe("a@example.test");
    expect(line.req.headers.accept).toBe("text/html");
    expect(line.req.headers.cookie).toBe("[redacted]");
  });

  it("logs a failed query's statement but not its bound values", () => {
    const { lines, destination } = capture();
    const logger = createLogger({ level: "info", destination });
    const cause = Object.assign(new Error("Duplicate entry"), { code: "ER_DUP_ENTRY", errno: 1062 });
    const err = Object.assign(
      new Error(
        "Failed query: insert into users (email, password_hash) values (?, ?)\nparams: a@x.test,$2b$12$hashhashhash",
      ),
      {
        query: "insert into users (email, password_hash) values (?, ?)",
        params: ["a@x.test", "$2b$12$hashhashhash"],
        cause,
      },
    );
    logger.error({ err }, "failed");
    const raw = JSON.stringify(lines);
    expect(raw).not.toContain("hashhashhash");
    expect(raw).toContain("insert into users");
    expect(raw).toContain("ER_DUP_ENTRY");
  });

  it("binds request id, user, lab, operation and duration on a child, leaving out what is unknown", () => {
    const { lines, destination } = capture();
    const child = logFor(
      { requestId: "r-1", userId: 7, labId: null, operation: "stock.toggle", durationMs: 12 },
      createLogger({ level: "info", destination }),
    );
    child.info("done");
    expect(lines[0]).toMatchObject({
      requestId: "r-1",
      userId: 7,
      operation: "stock.toggle",
      durationMs: 12,
      msg: "done",
    });
    expect(lines[0]).not.toHaveProperty("labId");
  });

  it("drops lines below the level", () => {
    const { lines, destination } = capture();
    const logger = createLogger({ level: "warn", destination });
    logger.info("quiet");
    logger.warn("loud");
    expect(lines.map((l) => l.msg)).toEqual(["loud"]);
  });
});

describe("LOG_LEVEL", () => {
  const before = process.env.LOG_LEVEL;
  afterEach(() => {
    if (before === undefined) delete process.env.LOG_LEVEL;
    else process.env.LOG_LEVEL = before;
    vi.resetModules();
  });

  it("sets the level of the app's logger", async () => {
    process.env.LOG_LEVEL = "error";
    vi.resetModules();
    const { log } = await import("@/lib/log");
    expect(log.level).toBe("error");
    expect(log.isLevelEnabled("warn")).toBe(false);
    expect(log.isLevelEnabled("error")).toBe(true);
  });

  it("refuses a level that does not exist", async () => {
    process.env.LOG_LEVEL = "loud";
    vi.resetModules();
    await expect(import("@/lib/log")).rejects.toThrow(/LOG_LEVEL/);
  });
});

describe("errors become answers and are logged once", () => {
  const refused = Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:3307"), {
    code: "ECONNREFUSED",
    errno: -111,
  });

  it("recognises connection failures through .cause chains, and not query errors", () => {
    expect(isDatabaseUnreachable(refused)).toBe(true);
    expect(isDatabaseUnreachable(new Error("Failed query", { cause: refused }))).toBe(true);
    expect(isDatabaseUnreachable(Object.assign(new Error("lost"), { code: "PROTOCOL_CONNECTION_LOST" }))).toBe(true);
    expect(
      isDatabaseUnreachable(
        Object.assign(new Error("Too many connections"), { code: "ER_CON_COUNT_ERROR", errno: 1040 }),
      ),
    ).toBe(true);
    expect(isDatabaseUnreachable(new AggregateError([refused], "all failed"))).toBe(true);
    expect(isDatabaseUnreachable(Object.assign(new Error("dup"), { code: "ER_DUP_ENTRY", errno: 1062 }))).toBe(false);
    expect(isDatabaseUnreachable(new Error("boom"))).toBe(false);
    expect(toAppError(new Error("x", { cause: refused })).code).toBe("unavailable");
  });

  it("answers 503 unavailable for an outage, 500 internal for a bug, and logs each once", async () => {
    const { lines, destination } = capture();
    const logger = createLogger({ level: "debug", destination });
    const down = errorResponse(new Error("Failed query: select 1", { cause: refused }), logger);
    expect(down.status).toBe(503);
    expect(await down.json()).toMatchObject({
      error: { code: "unavailable", message: expect.stringMatching(/cannot reach its database/) },
    });
    const bug = errorResponse(new TypeError("x is undefined"), logger);
    expect(bug.status).toBe(500);
    const bad = errorResponse(new AppError("invalid_input", "name: required"), logger);
    expect(bad.status).toBe(400);
    expect(lines.map((l) => l.level)).toEqual([40, 50, 20]);
  });
});
