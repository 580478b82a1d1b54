import { describe, expect, it } from "vitest";
import { checkWriteRequest, mediaType } from "@/lib/http/origin";

const APP = "http://localhost:3000";
const req = (method: string, headers: Record<string, string> = {}) => ({ method, headers: new Headers(headers) });

describe("checkWriteRequest (finding 5; wired by the request layer)", () => {
  it("lets reads through whatever their origin", () => {
    for (const m of ["GET", "HEAD", "OPTIONS", "get"])
      expect(checkWriteRequest(req(m, { origin: "http://evil.example" }), APP).ok).toBe(true);
  });

  it("refuses a write from another origin, including another port of the same host and 'null'", () => {
    for (const origin of ["http://evil.example", "http://localhost:3001", "https://localhost:3000", "null"]) {
      const r = checkWriteRequest(req("POST", { origin, "content-type": "application/json" }), APP, { jsonBody: true });
      expect(r, origin).toMatchObject({ ok: false, status: 403, code: "cross_site" });
    }
  });

  it("refuses a write whose Fetch Metadata says cross-site or same-site when no Origin is sent", () => {
    for (const site of ["cross-site", "same-site"])
      expect(checkWriteRequest(req("DELETE", { "sec-fetch-site": site }), APP)).toMatchObject({
        ok: false,
        status: 403,
      });
    expect(checkWriteRequest(req("DELETE", { "sec-fetch-site": "same-origin" }), APP).ok).toBe(true);
    expect(checkWriteRequest(req("DELETE", { "sec-fetch-site": "none" }), APP).ok).toBe(true);
  });

  it("accepts the app's own origin for every state-changing method", () => {
    for (const m of ["POST", "PUT", "PATCH", "DELETE"])
      expect(checkWriteRequest(req(m, { origin: APP, "sec-fetch-site": "same-origin" }), APP).ok).toBe(true);
  });

  it("requires exactly application/json for JSON bodies (a no-cors text/plain POST is refused)", () => {
    const same = { origin: APP };
    for (const type of [
      "text/plain",
      "application/x-www-form-urlencoded",
      "multipart/form-data; boundary=x",
      "application/json-patch+json",
      "",
    ])
      expect(
        checkWriteRequest(req("POST", { ...same, "content-type": type }), APP, { jsonBody: true }),
        type,
      ).toMatchObject({
        ok: false,
        status: 415,
      });
    for (const type of ["application/json", "Application/JSON; charset=utf-8"])
      expect(checkWriteRequest(req("POST", { ...same, "content-type": type }), APP, { jsonBody: true }).ok).toBe(true);
    // Without a JSON body (uploads), the type is the handler's business.
    expect(checkWriteRequest(req("PUT", { ...same, "content-type": "multipart/form-data" }), APP).ok).toBe(true);
  });

  it("exempts Bearer-token requests (machine tokens) from the origin check", () => {
    expect(
      checkWriteRequest(req("POST", { origin: "http://evil.example", authorization: "Bearer abc.def" }), APP).ok,
    ).toBe(true);
    expect(checkWriteRequest(req("POST", { origin: "http://evil.example", authorization: "Basic abc" }), APP).ok).toBe(
      false,
    );
  });

  it("reads media types without parameters", () => {
    expect(mediaType("Application/JSON ; charset=utf-8")).toBe("application/json");
    expect(mediaType(null)).toBe("");
  });
});
