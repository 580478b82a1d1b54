// Inputs that once answered 500, over HTTP against the built server (server.mjs): each must be
// a 4xx, and a generated sweep of action payload shapes must never reach a 5xx.
import { readFileSync } from "node:fs";
import path from "node:path";
import { expect, test } from "@playwright/test";
import fc from "fast-check";

const actionIds = () =>
  Object.keys(
    (
      JSON.parse(
        readFileSync(
          path.join(process.env.NEXT_DIST_DIR ?? ".next-test", "server", "server-reference-manifest.json"),
          "utf8",
        ),
      ) as { node: Record<string, unknown> }
    ).node,
  );

test("a path with undecodable %-escapes answers 400 with the security headers", async ({ request }) => {
  for (const url of ["/v/%ED%A0%80%ED%A0%80", "/c/%ED%A0%80", "/labs/%C0%AF", "/sign-in%FF"]) {
    const res = await request.get(url);
    expect(res.status(), url).toBe(400);
    expect(res.headers()["content-security-policy"], url).toBeTruthy();
  }
});

test("GET on the credentials callback answers 405, not 500", async ({ request }) => {
  const res = await request.get("/api/auth/callback/credentials", { maxRedirects: 0 });
  expect(res.status()).toBe(405);
  expect(res.headers()["allow"]).toBe("POST");
});

test("action bodies that are JSON but not an argument list answer 400", async ({ request }) => {
  const [id] = actionIds();
  for (const body of ['{"a":1}', "null", '["$@9"]', '"text"', "42", '[{"x":"$K1"}]']) {
    const res = await request.post("/sign-in", {
      headers: { "next-action": id!, "content-type": "text/plain;charset=UTF-8" },
      data: body,
    });
    expect(res.status(), body).toBe(400);
  }
});

test("a cross-origin server action is refused with 403, not 500", async ({ request }) => {
  const [id] = actionIds();
  const res = await request.post("/sign-in", {
    headers: { "next-action": id!, "content-type": "text/plain;charset=UTF-8", origin: "http://evil.example" },
    data: "[{},{}]",
  });
  expect(res.status()).toBe(403);
});

test("generated action payloads never answer 5xx (fast-check)", async ({ request }) => {
  const ids = actionIds();
  const dollar = fc.constantFrom("$@1", "$K0", "$Q", "$T", "$$x", "$undefined", "$D2026-01-01", "$n5", "\uD800");
  const body = fc.oneof(
    fc.jsonValue().map((v) => JSON.stringify(v)),
    fc.array(fc.oneof(dollar, fc.jsonValue()), { maxLength: 3 }).map((v) => JSON.stringify(v)),
    fc.string(),
  );
  let sent = 0;
  await fc.assert(
    fc.asyncProperty(fc.constantFrom(...ids), body, async (id, data) => {
      const res = await request.post("/sign-in", {
        headers: { "next-action": id, "content-type": "text/plain;charset=UTF-8" },
        data,
      });
      sent++;
      expect(res.status(), `${id} ${data}`).toBeLessThan(500);
    }),
    { numRuns: 150 },
  );
  console.log(`action payload fuzz: ${sent} requests, none 5xx`);
});
