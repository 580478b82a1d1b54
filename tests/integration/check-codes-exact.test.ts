import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { getCheckTokenByShortCode } from "@/db/queries/check";
import { getCheckByToken } from "@/lib/ops/check";
import { editions } from "@/db/schema";
import { shortCodeReply } from "@/lib/http/check-page";
import { approveEdition, createEdition, labWithSmallChart } from "./support/writes";

let token = "";
let shortCode = "";

beforeAll(async () => {
  const { team, chartId } = await labWithSmallChart({ name: "Exact codes" });
  const who = (r: "educator" | "lead") => ({ id: team.people[r].id, name: team.people[r].name });
  const ed = (await createEdition({ labId: team.lab.id, chartId, actor: who("educator") })) as { id: number };
  await approveEdition({ labId: team.lab.id, editionId: ed.id, actor: who("lead") });
  const [row] = await db
    .select({ t: editions.checkToken, c: editions.shortCode })
    .from(editions)
    .where(eq(editions.id, ed.id));
  [token, shortCode] = [row!.t, row!.c];
});

afterAll(() => pool.end());

const swapCase = (s: string) =>
  [...s].map((ch) => (ch === ch.toLowerCase() ? ch.toUpperCase() : ch.toLowerCase())).join("");

describe("check tokens and short codes compare exactly", () => {
  it("a check token in another letter case names no printout", async () => {
    expect(token).toMatch(/[a-z]/i);
    expect(swapCase(token)).not.toBe(token);
    expect(await getCheckByToken({ token })).not.toBeNull();
    expect(await getCheckByToken({ token: swapCase(token) })).toBeNull();
  });

  it("the stored short code is matched only byte for byte", async () => {
    expect(await getCheckTokenByShortCode({ code: shortCode })).toBe(token);
    expect(await getCheckTokenByShortCode({ code: shortCode.toLowerCase() })).toBeNull();
  });

  it("a typed short code still forgives case and O for 0: it is normalised before the lookup", async () => {
    const typed = shortCode.toLowerCase().replace(/0/g, "o");
    const reply = await shortCodeReply(new Headers({ "x-forkwall-peer": "192.0.2.40" }), typed);
    expect(reply.status).toBe(303);
    expect(reply.headers.location).toBe(`/v/${token}`);
  });
});
