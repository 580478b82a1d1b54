import { describe, expect, it } from "vitest";
import { buildSnapshot } from "@/lib/charts/snapshot";
import { fingerprintOf } from "@/lib/charts/fingerprint";
import { checkEdition, type CheckEdition } from "@/lib/editions/check";
import { canTransition } from "@/lib/editions/states";
import { staleNoticeMail } from "@/lib/mail/templates/stale-notice";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { ncStock } from "../../support/chart-fixtures";

const stock = (out: number[] = []) =>
  ncStock(out, { diameters: [2, 2.5, 3, 3.25, 3.5, 3.75, 4, 4.5], growthAtRbpMm: null });
const definition = chartDefinitionSchema.parse({
  title: "Kissing chart",
  law: { law: "square" },
  lookups: [
    {
      kind: "side",
      rows: { from: 3, to: 4, step: 0.25 },
      cols: { from: 2.5, to: 3.5, step: 0.25 },
      rounding: "down",
      familyId: 1,
    },
  ],
  paper: "TABLOID",
  orientation: "landscape",
  readingDistanceM: 2,
});
const snap = (out: number[] = []) =>
  buildSnapshot({ labName: "Test lab", definition, stock: stock(out), logoSha256: null });
const live = (out: number[] = []) => ({ liveFingerprint: fingerprintOf(snap(out)), liveSnapshot: snap(out) });

const edition = (over: Partial<CheckEdition> = {}): CheckEdition => ({
  id: 1,
  chartId: 1,
  number: 3,
  status: "approved",
  snapshot: snap(),
  fingerprint: fingerprintOf(snap()),
  approvedAt: new Date("2026-11-02T10:00:00Z"),
  supersededAt: null,
  withdrawnAt: null,
  ...over,
});

describe("check status rules", () => {
  it("an approved edition whose fingerprint matches today's is current", () => {
    expect(checkEdition(edition(), live(), null)).toEqual({ status: "current", changes: [] });
  });

  it("is outdated when the stock changed, naming the size, and current again once it is restored", () => {
    const out = checkEdition(edition(), live([2.5]), null);
    expect(out.status).toBe("outdated");
    expect(out.changes.map((c) => c.detail)).toContain("2.50 mm NC balloon no longer stocked (NC test family)");
    expect(checkEdition(edition(), live(), null).status).toBe("current");
    // Square-law side branches here stay below 3.0 mm, so a 3.25 mm size cannot change a cell.
    expect(checkEdition(edition(), live([3.25]), null).status).toBe("current");
  });

  it("superseded and withdrawn come from the edition's own state, before any fingerprint", () => {
    const sup = checkEdition(
      edition({ status: "superseded", supersededAt: new Date("2026-11-20T00:00:00Z") }),
      live([3.25]),
      { number: 4, approvedAt: new Date("2026-11-20T00:00:00Z") },
    );
    expect(sup).toEqual({
      status: "superseded",
      changes: [{ kind: "lab", detail: "Edition 4 approved on 2026-11-20" }],
    });
    expect(
      checkEdition(edition({ status: "withdrawn", withdrawnAt: new Date("2026-11-21T00:00:00Z") }), live(), null)
        .status,
    ).toBe("withdrawn");
    expect(checkEdition(edition({ status: "draft" }), live(), null).status).toBe("draft");
  });

  it("a chart that can no longer be resolved makes its approved editions outdated", () => {
    expect(checkEdition(edition(), null, null).status).toBe("outdated");
  });
});

describe("edition lifecycle", () => {
  it("only moves forward", () => {
    expect(canTransition("draft", "approved")).toBe(true);
    expect(canTransition("approved", "superseded")).toBe(true);
    expect(canTransition("superseded", "withdrawn")).toBe(true);
    expect(canTransition("approved", "draft")).toBe(false);
    expect(canTransition("withdrawn", "approved")).toBe(false);
    expect(canTransition("superseded", "approved")).toBe(false);
  });
});

describe("stale notice e-mail", () => {
  it("lists the rooms to visit and the edition to print", () => {
    const mail = staleNoticeMail(
      {
        labName: "Test lab",
        labSlug: "test",
        cause: "3.25 mm marked out of stock",
        items: [
          {
            room: "Room 1",
            chartId: 7,
            chartTitle: "Kissing chart",
            editionNumber: 3,
            status: "outdated",
            changes: ["3.25 mm NC balloon no longer stocked"],
            current: null,
          },
          {
            room: "Control room",
            chartId: 8,
            chartTitle: "POT chart",
            editionNumber: 1,
            status: "superseded",
            changes: [],
            current: { editionId: 42, number: 2 },
          },
        ],
      },
      "http://localhost:3000",
    );
    expect(mail.subject).toBe('Forkwall: 2 wall printouts to replace in "Test lab"');
    expect(mail.text).toContain("Rooms to visit: Control room, Room 1");
    expect(mail.text).toContain("Print edition 2: http://localhost:3000/api/v1/editions/42/pdf");
    expect(mail.text).toContain("http://localhost:3000/labs/test/charts/7");
  });
});
