import { beforeAll, describe, expect, it } from "vitest";
import { renderPosterPdf } from "@/lib/poster/pdf/render";
import { shortFingerprint } from "@/lib/charts/fingerprint";
import { gridJson } from "@/lib/charts/grid-model";
import { snapshotGrids, type Snapshot } from "@/lib/charts/snapshot";
import { CAUTION_TEXT } from "@/lib/cautions";
import { pickBalloon, type Grid, type GridMark } from "@/lib/sizing";
import { PNG } from "pngjs";
import { pdfText } from "@/tests/support/pdf-tools";
import { kissingDefinition, posterInput, potDefinition, snapshotOf } from "@/tests/support/poster-fixtures";

const squash = (s: string) => s.replace(/\s+/g, " ");

/** Shelf labels as printed: at least one decimal, at most two (written here independently). */
const shelf = (mm: number) => {
  const s = String(Number(mm.toFixed(2)));
  return s.includes(".") ? s : `${s}.0`;
};

type ParsedCell = { exact: string | null; corner: string; primary: string; pressure: string | null };

/**
 * Reads one grid back from the text: after the corner heading's "↓" come the column headings,
 * then the row headings, then each cell in reading order: "(exact)", corner marks, the large
 * figure and, for pushed balloons, "@ N atm".
 */
function readGrid(text: string, rows: number, cols: number) {
  const tokens = text.split(/\s+/).filter(Boolean);
  let i = tokens.indexOf("↓") + 1;
  const colHeads = tokens.slice(i, i + cols);
  i += cols;
  const rowHeads = tokens.slice(i, i + rows);
  i += rows;
  const cells: ParsedCell[][] = [];
  for (let r = 0; r < rows; r++) {
    const row: ParsedCell[] = [];
    for (let c = 0; c < cols; c++) {
      let exact: string | null = null;
      let corner = "";
      if (/^\(\d+\.\d\d\)$/.test(tokens[i] ?? "")) exact = tokens[i++] as string;
      if (/^[■↑↓◇]+$/u.test(tokens[i] ?? "")) corner = tokens[i++] as string;
      const primary = tokens[i++] as string;
      let pressure: string | null = null;
      if (tokens[i] === "@") {
        pressure = `@ ${tokens[i + 1]} ${tokens[i + 2]}`;
        i += 3;
      }
      row.push({ exact, corner, primary, pressure });
    }
    cells.push(row);
  }
  return { colHeads, rowHeads, cells, next: tokens[i] };
}

/**
 * What the grid API's model (gridJson) says each cell must print: the poster read back from its
 * PDF must agree with it cell for cell (size label, exact label, pressure and every mark).
 */
function expectedCells(snapshot: Snapshot, index = 0): ParsedCell[][] {
  const lookup = gridJson(snapshot).lookups[index]!;
  const CORNER: Partial<Record<GridMark, string>> = {
    "stent-limit": "■",
    oversize: "↑",
    undersize: "↓",
    "outside-fit": "◇",
  };
  return lookup.cells.map((row) =>
    row.map((cell) => {
      if (cell.marks.includes("not-bifurcation")) return { exact: null, corner: "", primary: "—", pressure: null };
      const corner = cell.marks.map((m) => CORNER[m] ?? "").join("");
      const primary =
        cell.sizeLabel ??
        (cell.marks.includes("below-stock") && cell.marks.includes("above-stock")
          ? "○"
          : cell.marks.includes("above-stock")
            ? "▲"
            : "▼");
      return {
        exact: `(${cell.exactLabel})`,
        corner,
        primary,
        pressure: cell.atm !== null ? `@ ${cell.atm} atm` : null,
      };
    }),
  );
}

describe("the POT poster read back (Finet, A2 portrait)", () => {
  const snapshot = snapshotOf(potDefinition);
  const input = posterInput(snapshot);
  const [grid] = snapshotGrids(snapshot) as [Grid];
  let text = "";
  let flat = "";
  let info: Record<string, unknown> = {};
  beforeAll(async () => {
    ({ text, info } = await pdfText(await renderPosterPdf(input)));
    flat = squash(text);
  }, 60_000);

  it("carries its metadata: title, author, subject, keywords, fixed dates", () => {
    expect(info.Title).toBe("POT balloon chart (illustrative)");
    expect(info.Author).toBe("Illustrative Cath Lab (demo)");
    expect(info.Subject).toBe("Edition 3");
    expect(String(info.Keywords)).toContain("Finet (ratio 0.678)");
    expect(info.CreationDate).toBe("D:20260302093000Z");
  });

  it("prints lab, title, law with formula and source, edition, approval, review date, short code, notes and the cautions", () => {
    for (const s of [
      "Illustrative Cath Lab (demo)",
      "POT balloon chart (illustrative)",
      // Too long for one line here: the law's name on its line, the formula whole on the next.
      "Law: Finet (ratio 0.678) Dp = 0.678 × (Dmb + Dsb)",
      "EuroIntervention (2008)",
      "Edition 3",
      "Approved 2026-03-02 by Dr A. Example (illustrative)",
      "Review by 2027-03-02",
      "Dates in UTC time",
      "K7QM-2XHD",
      "Measure the distal main branch",
      `CAUTION. ${CAUTION_TEXT}`,
      "POT balloon (parent) from main branch × side branch",
      "Side branch, mm →",
      "Main branch, mm",
      "Illustrative NC balloon: NC, nominal 12 atm, RBP 20 atm",
      "Balloon rounded up to the next stocked size",
      "Stent limit: Illustrative DES",
      "forkwall.example/c/K7QM-2XHD",
    ]) {
      expect(flat, s).toContain(s);
    }
    // Plain words on the wall: no fingerprint, no arc-minutes, no trade hedging, no code-style exponents.
    expect(flat).not.toContain(shortFingerprint(input.edition.fingerprint));
    expect(flat).not.toMatch(/Fingerprint|′|arc|common practice|\^/);
    // The QR code's long check address is not printed; the short one is.
    expect(flat).not.toContain("7Qk2xB9mPq4tW8zR3nY6cH1d");
    expect(flat).not.toContain("DRAFT");
    expect(flat).not.toMatch(/from memory/i);
    // The fixture lab is not flagged demo: no "invented and illustrative" clause.
    expect(flat).not.toContain("invented and illustrative");
  });

  it("explains every mark the chart uses in the legend, in words, and no other", () => {
    for (const s of [
      "How to read a cell",
      "Stocked balloon.",
      "— No size.",
      "▲▼ No stocked size.",
      "■ Stent limit.",
      "◇ Outside published fit.",
      "↑ Above the rounding cap.",
      "grey hatched",
      "heavy border",
      "Dsb/Dmb ≥ 0.75",
    ]) {
      expect(flat, s).toContain(s);
    }
    // No cell is below the cap, so the legend does not explain it.
    expect(flat).not.toContain("Below the rounding cap");
    expect(flat).not.toContain("this chart has none");
  });

  it("samples each legend line from a real cell, so the sample follows the chart's rounding rule", () => {
    const legend = flat.slice(flat.indexOf("How to read a cell"));
    const sample = /^How to read a cell \((\d\.\d\d)\) (\d\.\d+) Stocked balloon/.exec(legend);
    expect(sample).not.toBeNull();
    // Rounded up: the printed balloon is never below the exact diameter.
    expect(Number(sample![2])).toBeGreaterThanOrEqual(Number(sample![1]));
  });

  it("prints every cell as the grid model decides it", () => {
    const read = readGrid(text, grid.rowAxis.values.length, grid.colAxis.values.length);
    expect(read.colHeads).toEqual(grid.colAxis.values.map(shelf));
    expect(read.rowHeads).toEqual(grid.rowAxis.values.map(shelf));
    expect(read.cells).toEqual(expectedCells(snapshot));
    expect(read.next).toBe("CAUTION.");
    // The grid uses every kind of mark, so the check above covers them all.
    const all = read.cells.flat();
    expect(all.some((c) => c.primary === "—")).toBe(true);
    expect(all.some((c) => c.primary === "▲")).toBe(true);
    expect(all.some((c) => c.corner.includes("■"))).toBe(true);
    expect(all.some((c) => c.corner.includes("◇"))).toBe(true);
  });

  it("matches Finet's published formula computed here, rounded up to stock (POT, common practice)", () => {
    const read = readGrid(text, grid.rowAxis.values.length, grid.colAxis.values.length);
    const at = (mb: number, sb: number) =>
      read.cells[grid.rowAxis.values.indexOf(mb)]?.[grid.colAxis.values.indexOf(sb)];
    // Dp = 0.678 (Dmb + Dsb): Finet G et al., EuroIntervention 2008.
    const dp = 0.678 * (3 + 2.5); // 3.729
    expect(at(3, 2.5)).toMatchObject({ exact: `(${dp.toFixed(2)})`, primary: "3.75" });
    const dp2 = 0.678 * (3.5 + 3.25); // 4.5765; 4.75 is out of stock in the fixture, so 5.0
    // 5.0 is 0.42 mm above 4.58 (past the 0.25 mm cap above, common practice): ↑ beside ■.
    expect(at(3.5, 3.25)).toMatchObject({ exact: "(4.58)", primary: "5.0", corner: "■↑" });
    expect(pickBalloon(dp2, snapshot.lookups[0]!.family!, "up")).toMatchObject({ ok: true, diameterMm: 5 });
    // Finet gives no parent above the main branch when Dsb < 0.4749 Dmb... and for Dsb > Dmb there is no bifurcation.
    expect(at(2.5, 2.75)?.primary).toBe("—");
  });
});

describe("the kissing poster read back (square law, Tabloid landscape, draft)", () => {
  const snapshot = snapshotOf(kissingDefinition);
  const [grid] = snapshotGrids(snapshot) as [Grid];
  let text = "";
  beforeAll(async () => {
    ({ text } = await pdfText(
      await renderPosterPdf(posterInput(snapshot, { status: "draft", approvedAt: null, approvedByName: null })),
    ));
  }, 60_000);

  it("prints the square law and every cell as the model decides, with the draft marks", () => {
    const flat = squash(text);
    expect(flat).toContain("Law: Square (area-preserving)");
    // Exponents are typeset raised (real superscripts), so the text layer reads plain digits.
    expect(flat).toMatch(/Dp ?2 = Dmb ?2 \+ Dsb ?2/);
    expect(flat).not.toContain("^");
    expect(flat).toContain("DRAFT — not approved");
    expect(flat).toContain("Side-branch balloon from parent × main branch");
    expect(flat).toContain("Balloon rounded down to the next smaller stocked size");
    expect(flat).not.toContain("common practice");
    expect(flat).toContain("Stocked balloon.");
    const read = readGrid(text, grid.rowAxis.values.length, grid.colAxis.values.length);
    expect(read.cells).toEqual(expectedCells(snapshot));
  });

  it("matches the square law computed here, rounded down to stock (side branch, common practice)", () => {
    const read = readGrid(text, grid.rowAxis.values.length, grid.colAxis.values.length);
    const at = (p: number, mb: number) => read.cells[grid.rowAxis.values.indexOf(p)]?.[grid.colAxis.values.indexOf(mb)];
    // Dp² = Dmb² + Dsb²  =>  Dsb = sqrt(Dp² - Dmb²)
    const sb = Math.sqrt(3.5 ** 2 - 2.5 ** 2); // 2.449
    expect(at(3.5, 2.5)).toMatchObject({ exact: `(${sb.toFixed(2)})`, primary: "2.25" });
    const sb2 = Math.sqrt(4.5 ** 2 - 3.25 ** 2); // 3.112
    expect(at(4.5, 3.25)).toMatchObject({ exact: `(${sb2.toFixed(2)})`, primary: "3.0" });
  });
});

describe("the lab's logo", () => {
  it("is embedded as an image in the header", { timeout: 60_000 }, async () => {
    // An invented mark: a teal disc on white.
    const png = new PNG({ width: 64, height: 64 });
    for (let i = 0; i < 64 * 64; i++) {
      const x = i % 64;
      const y = Math.floor(i / 64);
      const on = (x - 32) ** 2 + (y - 32) ** 2 < 28 ** 2;
      png.data.set(on ? [29, 101, 118, 255] : [255, 255, 255, 255], i * 4);
    }
    const input = {
      ...posterInput(snapshotOf(potDefinition)),
      logo: { bytes: PNG.sync.write(png), mime: "image/png" as const },
    };
    const withLogo = (await renderPosterPdf(input)).toString("latin1");
    const without = (await renderPosterPdf(posterInput(snapshotOf(potDefinition)))).toString("latin1");
    expect(withLogo).toMatch(/\/Subtype \/Image/);
    expect(without).not.toMatch(/\/Subtype \/Image/);
  });
});

describe("the lab's print settings and rule exceptions", () => {
  it(
    "prints decimal commas, dates in the lab's time zone and the recorded exceptions",
    { timeout: 60_000 },
    async () => {
      const snapshot = {
        ...snapshotOf(potDefinition),
        ruleExceptions: [
          {
            rule: "legibility",
            reason: "Hangs beside the table, read from 1 m (illustrative)",
            relaxes: "read from 1.5 m",
            recordedBy: "Dr B. Example (illustrative)",
            recordedOn: "2026-02-27",
          },
        ],
      };
      const input = {
        ...posterInput(snapshot, { approvedAt: new Date(Date.UTC(2026, 2, 2, 20, 0)) }),
        lab: { timeZone: "Australia/Sydney", numberFormat: "comma" as const },
      };
      const flat = squash((await pdfText(await renderPosterPdf(input))).text);
      // 20:00 UTC on 2 March is 07:00 on 3 March in Sydney (UTC+11 in March).
      expect(flat).toContain("Approved 2026-03-03 by Dr A. Example (illustrative)");
      expect(flat).toContain("Dates in Australia/Sydney time");
      expect(flat).toContain("Dp = 0,678 × (Dmb + Dsb)");
      expect(flat).toMatch(/\(3,05\) 3,25/);
      expect(flat).not.toMatch(/\(3\.05\)/);
      // The exception names what it relaxes and who recorded it, with the lab's decimal comma.
      expect(flat).toContain(
        "Legibility exception: read from 1,5 m, recorded by Dr B. Example (illustrative) on 2026-02-27. Reason: Hangs beside the table, read from 1 m (illustrative)",
      );
    },
  );
});
