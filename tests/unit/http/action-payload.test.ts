import { describe, expect, it } from "vitest";
import { checkActionPayload, isActionRequest, sameHostOrigin } from "@/lib/http/action-payload";

const never = async () => {
  throw new Error("not read");
};

describe("server-action payloads", () => {
  it("knows an action request by its POST method and next-action header", () => {
    expect(isActionRequest("POST", new Headers({ "next-action": "abc" }))).toBe(true);
    expect(isActionRequest("post", new Headers({ "next-action": "abc" }))).toBe(true);
    expect(isActionRequest("GET", new Headers({ "next-action": "abc" }))).toBe(false);
    expect(isActionRequest("POST", new Headers())).toBe(false);
  });

  it("accepts the JSON text the framework's client sends and refuses anything else as text", async () => {
    expect(await checkActionPayload("text/plain;charset=UTF-8", async () => '[{"slug":"demo"}]', never)).toEqual({
      ok: true,
    });
    const bad = await checkActionPayload("text/plain", async () => "garbage{", never);
    expect(bad.ok).toBe(false);
  });

  it("accepts a form it can parse and refuses a broken multipart body", async () => {
    const ok = new Request("http://x/", { method: "POST", body: new FormData() });
    expect(await checkActionPayload(ok.headers.get("content-type"), never, () => ok.formData())).toEqual({ ok: true });
    const broken = new Request("http://x/", {
      method: "POST",
      headers: { "content-type": "multipart/form-data; boundary=xyz" },
      body: "garbage{",
    });
    expect((await checkActionPayload(broken.headers.get("content-type"), never, () => broken.formData())).ok).toBe(
      false,
    );
  });

  it("leaves other content types to the framework, which refuses them itself", async () => {
    expect(await checkActionPayload("application/x-www-form-urlencoded", never, never)).toEqual({ ok: true });
  });

  it("refuses JSON that is not a list of arguments, or that points at parts a text body cannot have", async () => {
    for (const body of ['{"a":1}', "null", "3", '"x"', '["$@9"]', '[{"file":"$K1"}]', '["$Q2"]'])
      expect((await checkActionPayload("text/plain", async () => body, never)).ok, body).toBe(false);
    for (const body of ["[]", '["$$dollar", "$undefined", "$D2026-01-01T00:00:00.000Z", "$n12"]', '[{"n":"$-0"}]'])
      expect((await checkActionPayload("text/plain", async () => body, never)).ok, body).toBe(true);
  });

  it("tells a cross-origin action apart by its Origin and Host", () => {
    expect(sameHostOrigin(new Headers({ host: "localhost:3000" }))).toBe(true);
    expect(sameHostOrigin(new Headers({ host: "localhost:3000", origin: "http://localhost:3000" }))).toBe(true);
    expect(sameHostOrigin(new Headers({ host: "localhost:3000", origin: "http://evil.example" }))).toBe(false);
    expect(sameHostOrigin(new Headers({ host: "localhost:3000", origin: "null" }))).toBe(false);
  });
});
