import { describe, expect, it } from "vitest";
import { CELL_BACKGROUNDS, MARK_ORDER, MARKS, TEXT_ON_BACKGROUND } from "@/lib/poster/marks";

// WCAG 2.x relative luminance and contrast ratio, written out here rather than imported.
const channel = (c8: number) => {
  const c = c8 / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
};
const rgb = (hex: string) => {
  const n = parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255] as const;
};
const linear = (hex: string) => rgb(hex).map(channel) as [number, number, number];
const luminance = ([r, g, b]: readonly number[]) =>
  0.2126 * (r as number) + 0.7152 * (g as number) + 0.0722 * (b as number);
const contrast = (a: string, b: string) => {
  const [hi, lo] = [luminance(linear(a)), luminance(linear(b))].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
};
/** CIE L* (perceptual lightness, 0-100) of a relative luminance: what a greyscale print keeps. */
const lightness = (y: number) => (y > 216 / 24389 ? 116 * Math.cbrt(y) - 16 : (y * 24389) / 27);

// Dichromat simulation in linear RGB, Machado, Oliveira & Fernandes, IEEE TVCG 2009, severity 1.0
// (matrices from memory).
const SIMULATIONS: Record<string, number[][]> = {
  protanopia: [
    [0.152286, 1.052583, -0.204868],
    [0.114503, 0.786281, 0.099216],
    [-0.003882, -0.048116, 1.051998],
  ],
  deuteranopia: [
    [0.367322, 0.860646, -0.227968],
    [0.280085, 0.672501, 0.047413],
    [-0.01182, 0.04294, 0.968881],
  ],
  tritanopia: [
    [1.255528, -0.076749, -0.178779],
    [-0.078411, 0.930809, 0.147602],
    [0.004733, 0.691367, 0.3039],
  ],
};
const simulate = (m: number[][], v: readonly number[]) =>
  m.map((row) =>
    Math.min(
      1,
      Math.max(
        0,
        row.reduce((s, k, i) => s + k * (v[i] as number), 0),
      ),
    ),
  );

describe("poster palette", () => {
  it("gives every text at least 4.5:1 on each background it is printed on (WCAG 2.x AA)", () => {
    for (const pair of TEXT_ON_BACKGROUND) {
      const ratio = contrast(pair.text, pair.background);
      expect(ratio, `${pair.what}: ${pair.text} on ${pair.background}`).toBeGreaterThanOrEqual(4.5);
    }
  });

  it("keeps the large cell figures at 7:1 or more on every cell background (WCAG AAA)", () => {
    for (const pair of TEXT_ON_BACKGROUND.filter((p) => p.what.startsWith("cell figures"))) {
      expect(contrast(pair.text, pair.background), pair.what).toBeGreaterThanOrEqual(7);
    }
  });

  it("separates the cell backgrounds by at least 8 L* in greyscale", () => {
    const entries = Object.entries(CELL_BACKGROUNDS);
    for (let i = 0; i < entries.length; i++) {
      for (let j = i + 1; j < entries.length; j++) {
        const [a, ca] = entries[i] as [string, string];
        const [b, cb] = entries[j] as [string, string];
        const d = Math.abs(lightness(luminance(linear(ca))) - lightness(luminance(linear(cb))));
        expect(d, `${a} vs ${b}`).toBeGreaterThanOrEqual(8);
      }
    }
  });

  it("keeps the backgrounds apart for protan, deutan and tritan readers", () => {
    for (const [name, m] of Object.entries(SIMULATIONS)) {
      const seen = Object.entries(CELL_BACKGROUNDS).map(([k, hex]) => [k, simulate(m, linear(hex))] as const);
      for (let i = 0; i < seen.length; i++) {
        for (let j = i + 1; j < seen.length; j++) {
          const [a, va] = seen[i] as (typeof seen)[number];
          const [b, vb] = seen[j] as (typeof seen)[number];
          const d = Math.abs(lightness(luminance(va)) - lightness(luminance(vb)));
          expect(d, `${name}: ${a} vs ${b}`).toBeGreaterThanOrEqual(6);
        }
      }
    }
  });

  it("never relies on colour alone: every mark has its own symbol, a word label and a pattern, border or symbol-only overlay", () => {
    const symbols = MARK_ORDER.map((m) => MARKS[m].symbol);
    expect(new Set(symbols).size).toBe(symbols.length);
    for (const m of MARK_ORDER) {
      const def = MARKS[m];
      expect(def.label.length).toBeGreaterThan(3);
      expect(def.explanation.length).toBeGreaterThan(20);
      expect(def.symbol.trim()).not.toBe("");
    }
    expect(MARKS.noSize.hatch).toBe(true);
    expect(MARKS.hazard.border).toBeGreaterThan(0);
    expect(MARKS.outsideFit.background).toBeNull();
  });
});
