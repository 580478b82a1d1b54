// The public check page as plain HTML with its own small stylesheet: what a phone gets when it
// scans a poster's QR code. No client script, no web font, no framework runtime, so a scan
// transfers a few kilobytes (README "Speed"). Colours are the product's (tailwind.config.ts).
import { CAUTION_TEXT, cautionFor } from "@/lib/cautions";
import type { CellDiff } from "@/lib/charts/cell-diff";
import type { CopyAction } from "./action";
import type { CheckStatus } from "./check";
import type { CheckCells } from "./check-cells";

export type CheckPageModel = {
  status: CheckStatus;
  action: CopyAction;
  headline: string;
  /** "Approved 2026-12-02", in the lab's time zone; null when there is no date. */
  dateLine: string | null;
  sentence: string;
  labName: string;
  chartTitle: string;
  editionNumber: number;
  /** Printed form, K7QM-2XHD. */
  shortCode: string;
  changes: string[];
  cells: CheckCells;
  /** "No approved replacement yet: ask ..."; null unless the copy must come down. */
  ask: string | null;
  currentLine: string | null;
  /** "A reworded edition is available (...)": only wording or layout differs; null when none. */
  reworded: string | null;
  isDemo: boolean;
  signInHref: string;
};

// A symbol and a word for every status: colour is never the only signal.
const LOOK: Record<CheckStatus, { symbol: string; cls: string }> = {
  current: { symbol: "✓", cls: "ok" },
  outdated: { symbol: "!", cls: "warn" },
  superseded: { symbol: "↻", cls: "warn" },
  withdrawn: { symbol: "✕", cls: "bad" },
  draft: { symbol: "✎", cls: "bad" },
};

const STYLE = `*{box-sizing:border-box}
html{-webkit-text-size-adjust:100%}
body{margin:0;background:#f7f8f6;color:#17212b;font-family:system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;line-height:1.5;overflow-wrap:anywhere}
header{border-bottom:1px solid #d5dbdf;background:#fff}
header a{display:block;max-width:40rem;margin:0 auto;padding:.6rem 1rem;color:#113d48;font-weight:700;font-size:1.1rem;text-decoration:none}
main{max-width:40rem;margin:0 auto;padding:1rem 1rem 2rem}
.meta{margin:0;color:#3d4b59;font-size:.9rem}
.box{margin-top:.75rem;border:4px solid;border-radius:.75rem;padding:1rem}
.ok{border-color:#1d5fa8;background:#e5effa;color:#1d5fa8}
.warn{border-color:#8a5300;background:#fdf1dc;color:#8a5300}
.bad{border-color:#a3261f;background:#fbe9e7;color:#a3261f}
.word{display:flex;align-items:center;gap:.6rem;margin:0;font-weight:700;line-height:1.05;font-size:clamp(1.6rem,9vw,3.25rem)}
.sym{display:inline-flex;flex:none;align-items:center;justify-content:center;width:2.6rem;height:2.6rem;border:4px solid currentColor;border-radius:50%;font-size:1.6rem}
.word span:last-child{min-width:0}
.date{margin:.6rem 0 0;color:#17212b;font-weight:500}
.act{margin:1rem 0 0;font-size:1.15rem;font-weight:600}
h2{margin:1.25rem 0 .25rem;font-size:1rem}
ul{margin:.25rem 0 0;padding-left:1.2rem}
li{margin-top:.35rem}
.cells{list-style:none;padding:0}
.cells li{border:1px solid #d5dbdf;border-radius:.5rem;background:#fff;padding:.5rem .75rem}
.where{display:block;font-weight:600}
del{color:#a3261f;text-decoration-thickness:2px}
.ask{margin:1rem 0 0;border-left:4px solid #a3261f;padding:.25rem .75rem;font-weight:600}
.code{margin:1rem 0 0;color:#3d4b59;font-size:.9rem}
.code b{font-family:ui-monospace,monospace;letter-spacing:.05em;color:#17212b}
.note{margin-top:1.5rem;border:1px solid rgba(138,83,0,.4);border-radius:.4rem;background:#fdf1dc;padding:.75rem 1rem;font-size:.9rem}
.soft{color:#3d4b59;font-size:.9rem}
a{color:#164f5d}
.d{white-space:nowrap}`;

export const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

/** Escaped text whose ISO dates never break across lines. */
const text = (s: string) => escapeHtml(s).replace(/\d{4}-\d{2}-\d{2}/g, (d) => `<span class="d">${d}</span>`);

function shell(title: string, body: string): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex"><meta name="theme-color" content="#164f5d">
<title>${escapeHtml(title)} · Forkwall</title><link rel="icon" href="/icon.svg" type="image/svg+xml"><style>${STYLE}</style></head>
<body><header><a href="/">Forkwall</a></header><main id="main">${body}</main></body></html>`;
}

const caution = (demo: boolean) =>
  `<aside class="note" role="note" aria-label="Clinical caution"><strong>Caution: </strong>${escapeHtml(cautionFor(demo))}</aside>`;

function cellItem(c: CellDiff, mode: "replace" | "affected", replacement?: number): string {
  const where = `<span class="where">${escapeHtml(c.where)}</span>`;
  if (mode === "affected")
    return `<li>${where}This copy prints <del>${escapeHtml(c.printed.text)}</del>: do not use it.</li>`;
  const now = c.other ? escapeHtml(c.other.text) : "not printed";
  return `<li>${where}This copy: <del>${escapeHtml(c.printed.text)}</del> · edition ${replacement}: <b>${now}</b></li>`;
}

function cellsSection(cells: CheckCells): string {
  if (cells.kind === "none") return "";
  if (cells.kind === "replace") {
    if (cells.cells.length === 0)
      return `<p class="soft">No printed cell differs; the new edition changes only its wording or settings.</p>`;
    return `<section aria-labelledby="cells-h"><h2 id="cells-h">${cells.cells.length} cell${cells.cells.length === 1 ? "" : "s"} differ from edition ${cells.replacementNumber}</h2>
<ul class="cells" data-testid="check-cells" data-kind="replace">${cells.cells.map((c) => cellItem(c, "replace", cells.replacementNumber)).join("")}</ul></section>`;
  }
  if (cells.cells.length === 0) return "";
  return `<section aria-labelledby="cells-h"><h2 id="cells-h">Cells on this copy that no longer hold</h2>
<ul class="cells" data-testid="check-cells" data-kind="affected">${cells.cells.map((c) => cellItem(c, "affected")).join("")}</ul></section>`;
}

/** The check page for one copy. */
export function checkPageHtml(m: CheckPageModel): string {
  const look = LOOK[m.status];
  const changes = m.changes.length
    ? `<section aria-labelledby="changes-h"><h2 id="changes-h">What changed</h2><ul data-testid="check-changes">${m.changes
        .map((c) => `<li>${text(c)}</li>`)
        .join("")}</ul></section>`
    : "";
  const body = `<h1 style="position:absolute;width:1px;height:1px;overflow:hidden;clip:rect(0 0 0 0)">Is this printout current?</h1>
<p class="meta">${escapeHtml(m.labName)} · ${escapeHtml(m.chartTitle)} · edition ${m.editionNumber}</p>
<div class="box ${look.cls}" data-testid="check-status" data-status="${m.status}">
<p class="word"><span class="sym" aria-hidden="true">${look.symbol}</span><span>${escapeHtml(m.headline)}</span></p>
${m.dateLine ? `<p class="date" data-testid="check-date">${text(m.dateLine)}</p>` : ""}
</div>
<p class="act" data-testid="check-action" data-action="${m.action}">${text(m.sentence)}</p>
${m.ask ? `<p class="ask" data-testid="check-ask">${escapeHtml(m.ask)}</p>` : ""}
${m.reworded ? `<p data-testid="check-reworded">${text(m.reworded)}</p>` : ""}
${cellsSection(m.cells)}
${changes}
${m.currentLine ? `<p class="soft">${text(m.currentLine)}</p>` : ""}
<p class="code">Code on this copy: <b data-testid="check-code">${escapeHtml(m.shortCode)}</b></p>
<p class="soft">Lab members can <a href="${escapeHtml(m.signInHref)}">sign in</a> to record where this copy hangs or to print the current edition.</p>
${caution(m.isDemo)}`;
  return shell("Is this printout current?", body);
}

/** The one answer for a malformed token, an unknown token, a malformed short code and an unknown one. */
export function unknownCodeHtml(): string {
  return shell(
    "Not a Forkwall poster",
    `<div class="box bad" role="alert" data-testid="check-unknown"><p class="word" style="font-size:clamp(1.4rem,7vw,2.25rem)"><span class="sym" aria-hidden="true">✕</span><span>Unverified</span></p>
<h1 style="margin:.5rem 0 0;font-size:1.2rem;color:#17212b">This code is not a Forkwall poster</h1>
<p style="color:#17212b">No chart edition has this code. Do not rely on the printout that carries it: ask your lab for its current approved chart.</p></div>
<aside class="note" role="note" aria-label="Clinical caution"><strong>Caution: </strong>${escapeHtml(CAUTION_TEXT)}</aside>`,
  );
}

/** Too many checks from one address: the copy cannot be vouched for right now. */
export function rateLimitedHtml(message: string): string {
  return shell(
    "Try again shortly",
    `<div class="box warn" role="alert"><h1 style="margin:0;font-size:1.25rem">This printout cannot be verified right now</h1>
<p style="color:#17212b">${escapeHtml(message)} Until it is verified, do not rely on its numbers.</p></div>`,
  );
}
