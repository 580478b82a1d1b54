import { describe, expect, it } from "vitest";
import { parseEnv } from "@/lib/env";

describe("SIGNUP", () => {
  it("defaults to open on a loopback APP_URL (development, tests, a local npm start)", () => {
    expect(parseEnv({}).data?.SIGNUP).toBe("open");
    expect(parseEnv({ APP_URL: "http://127.0.0.1:3000" }).data?.SIGNUP).toBe("open");
  });

  it("defaults to invite-only on a public address, and follows an explicit setting", () => {
    expect(parseEnv({ APP_URL: "https://forkwall.hospital.example" }).data?.SIGNUP).toBe("invite-only");
    expect(parseEnv({ APP_URL: "https://forkwall.hospital.example", SIGNUP: "open" }).data?.SIGNUP).toBe("open");
    expect(parseEnv({ SIGNUP: "invite-only" }).data?.SIGNUP).toBe("invite-only");
  });

  it("refuses anything else, naming the variable", () => {
    const parsed = parseEnv({ SIGNUP: "closed" });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0]?.path).toEqual(["SIGNUP"]);
  });
});
