import { execFileSync } from "node:child_process";
import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { renderPosterPdf } from "@/lib/poster/pdf/render";
import { pdfText } from "@/tests/support/pdf-tools";
import { posterInput, potDefinition, snapshotOf } from "@/tests/support/poster-fixtures";

const sha = (b: Buffer) => createHash("sha256").update(b).digest("hex");
const snapshot = snapshotOf(potDefinition);
const draft = { status: "draft", approvedAt: null, approvedByName: null } as const;

describe("byte-identical renders", () => {
  it("gives the same SHA-256 for the same input, in this process and in a fresh one", { timeout: 60_000 }, async () => {
    const a = await renderPosterPdf(posterInput(snapshot));
    const b = await renderPosterPdf(posterInput(snapshotOf(potDefinition)));
    expect(sha(a)).toBe(sha(b));
    const fresh = execFileSync(process.execPath, ["--import", "tsx", "tests/support/render-sha.ts"], {
      encoding: "utf8",
    }).trim();
    expect(fresh).toBe(sha(a));
    // pdfkit's /ID is derived from the metadata, which carries no clock: it repeats too.
    const id = (pdf: Buffer) => /\/ID \[<([0-9a-f]+)>/.exec(pdf.toString("latin1"))?.[1];
    expect(id(a)).toMatch(/^[0-9a-f]{32}$/);
    expect(id(a)).toBe(id(b));
  });

  // The diagonal stamp is drawn over the render (lib/poster/pdf/print.ts, tests/tools/poster/stamps.test.ts).
  it("changes with the status, and only drafts say they are not approved", { timeout: 60_000 }, async () => {
    const approved = await renderPosterPdf(posterInput(snapshot));
    const drafted = await renderPosterPdf(posterInput(snapshot, draft));
    expect(sha(drafted)).not.toBe(sha(approved));
    expect(sha(await renderPosterPdf(posterInput(snapshot, draft)))).toBe(sha(drafted));
    const draftText = (await pdfText(drafted)).text;
    const approvedText = (await pdfText(approved)).text;
    expect(draftText).toContain("DRAFT — not approved, not for clinical use");
    expect(draftText).toContain("DRAFT — not approved");
    expect(approvedText).not.toContain("DRAFT");
    // A draft's metadata dates are the fixed epoch, never the clock.
    expect((await pdfText(drafted)).info.CreationDate).toBe("D:20000101000000Z");
  });

  it(
    "prints a banner on superseded and withdrawn editions, without the draft's words",
    { timeout: 60_000 },
    async () => {
      const superseded = (await pdfText(await renderPosterPdf(posterInput(snapshot, { status: "superseded" })))).text;
      const withdrawn = (await pdfText(await renderPosterPdf(posterInput(snapshot, { status: "withdrawn" })))).text;
      expect(superseded.replace(/\s+/g, " ")).toContain("SUPERSEDED — a newer edition replaces this poster");
      expect(withdrawn.replace(/\s+/g, " ")).toContain("WITHDRAWN — do not use");
      expect(superseded).not.toContain("DRAFT");
      expect(withdrawn).not.toContain("DRAFT");
    },
  );
});
