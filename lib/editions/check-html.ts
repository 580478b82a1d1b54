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
  /** The first heading: "Keep this copy", ... (ACTION_HEADINGS). */
  heading: string;
  /** The status in a word or two: "Superseded". */
  statusWord: string;
  /** Said only for a copy of a withdrawn or never-approved edition. */
  warning: string | null;
  /** "Approved 2026-12-02", in the lab's time zone; null when there is no date. */
  dateLine: string | null;
  /** Why, and the one person to ask when someone must act (actionSentence). */
  sentence: string;
  labName: string;
  chartTitle: string;
  editionNumber: number;
  /** Printed form, K7QM-2XHD. */
  shortCode: string;
  changes: string[];
  cells: CheckCells;
  /** The chart's current edition, when the sentence has not already named it. */
  currentLine: string | null;
  /** "A reworded edition is available (...)": only wording or layout differs; null when none. */
  reworded: string | null;
  isDemo: boolean;
  signInHref: string;
};

// One colour, symbol and border per action: in greyscale the symbol, the border and the words still tell them apart.
export const ACTION_LOOK: Readonly<Record<CopyAction, { symbol: string; cls: string }>> = {
  keep: { symbol: "✓", cls: "keep" },
  replace: { symbol: "↻", cls: "replace" },
  "take-down": { symbol: "✕", cls: "down" },
  review: { symbol: "?", cls: "review" },
};

const STYLE = `*{box-sizing:border-box}
html{-webkit-text-size-adjust:100%}
body{margin:0;background:#f7f8f6;color:#17212b;font-family:system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;font-size:1rem;line-height:1.5;overflow-wrap:anywhere}
header{border-bottom:1px solid #d5dbdf;background:#fff}
header a{display:flex;align-items:center;min-height:44px;max-width:40rem;margin:0 auto;padding:0 1rem;color:#113d48;font-weight:700;font-size:1.1rem;text-decoration:none}
main{max-width:40rem;margin:0 auto;padding:1rem 1rem 2rem}
.meta{margin:0;color:#3d4b59}
.box{margin-top:.75rem;border:4px solid;border-radius:.75rem;padding:1rem}
.keep{border-style:solid;border-color:#1d5fa8;background:#e5effa;color:#1d5fa8}
.replace{border-style:dashed;border-color:#8a5300;background:#fdf1dc;color:#8a5300}
.down{border-style:double;border-width:7px;border-color:#a3261f;background:#fbe9e7;color:#a3261f}
.review{border-style:dotted;border-color:#5b3a8c;background:#f1ebf8;color:#5b3a8c}
.word{display:flex;align-items:center;gap:.6rem;margin:0;font-weight:700;line-height:1.1;font-size:clamp(1.6rem,8.5vw,3rem)}
.sym{display:inline-flex;flex:none;align-items:center;justify-content:center;width:2.6rem;height:2.6rem;border:4px solid currentColor;border-radius:50%;font-size:1.6rem}
.word h1{min-width:0;margin:0;font:inherit}
.act{margin:.75rem 0 0;color:#17212b;font-size:1.15rem;font-weight:600}
.status{margin:1rem 0 0}
h2{margin:1.25rem 0 .25rem;font-size:1.05rem}
ul{margin:.25rem 0 0;padding-left:1.2rem}
li{margin-top:.35rem}
.cells{list-style:none;padding:0}
.cells li{border:1px solid #d5dbdf;border-radius:.5rem;background:#fff;padding:.5rem .75rem}
.where{display:block;font-weight:600}
del{color:#a3261f;text-decoration-thickness:2px}
.code{margin:1rem 0 0;color:#3d4b59}
.code b{font-family:ui-monospace,monospace;letter-spacing:.05em;color:#17212b}
.note{margin-top:1.5rem;border:1px solid rgba(138,83,0,.4);border-radius:.4rem;background:#fdf1dc;padding:.75rem 1rem}
.soft{color:#3d4b59}
a{color:#164f5d}
.btn{display:inline-flex;align-items:center;min-height:44px;min-width:44px;padding:0 .75rem;border:1px solid #a9b4bc;border-radius:.4rem;background:#fff;font-weight:600}
form{display:flex;flex-wrap:wrap;gap:.5rem;align-items:flex-end;margin-top:1rem}
label{display:block;width:100%;font-weight:600}
input{min-height:44px;flex:1 1 10rem;min-width:0;padding:0 .75rem;border:1px solid #66727f;border-radius:.4rem;font:inherit;font-family:ui-monospace,monospace;text-transform:uppercase}
button{min-height:44px;min-width:44px;padding:0 1rem;border:0;border-radius:.4rem;background:#164f5d;color:#fff;font:inherit;font-weight:600}
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

/** The check page for one copy: the action first, then the status and the reasons, each once. */
export function checkPageHtml(m: CheckPageModel): string {
  const look = ACTION_LOOK[m.action];
  const changes = m.changes.length
    ? `<section aria-labelledby="changes-h"><h2 id="changes-h">What changed</h2><ul data-testid="check-changes">${m.changes
        .map((c) => `<li>${text(c)}</li>`)
        .join("")}</ul></section>`
    : "";
  const date = m.dateLine ? ` · <span data-testid="check-date">${text(m.dateLine)}</span>` : "";
  const body = `<p class="meta">${escapeHtml(m.labName)} · ${escapeHtml(m.chartTitle)} · edition ${m.editionNumber}</p>
<div class="box ${look.cls}" data-testid="check-verdict" data-action="${m.action}">
<div class="word"><span class="sym" aria-hidden="true">${look.symbol}</span><h1>${escapeHtml(m.heading)}</h1></div>
<p class="act" data-testid="check-action" data-action="${m.action}">${text(m.sentence)}</p>
</div>
<p class="status" data-testid="check-status" data-status="${m.status}">Status: <strong>${escapeHtml(m.statusWord)}</strong>${date}${
    m.warning ? ` <strong data-testid="check-warning">${escapeHtml(m.warning)}</strong>` : ""
  }</p>
${m.reworded ? `<p data-testid="check-reworded">${text(m.reworded)}</p>` : ""}
${cellsSection(m.cells)}
${changes}
${m.currentLine ? `<p class="soft">${text(m.currentLine)}</p>` : ""}
<p class="code">Code on this copy: <b data-testid="check-code">${escapeHtml(m.shortCode)}</b></p>
<p class="soft">Lab members can sign in to record where this copy hangs or to print the current edition.</p>
<p><a class="btn" href="${escapeHtml(m.signInHref)}">Sign in</a></p>
${caution(m.isDemo)}`;
  return shell(`${m.heading} · Is this printout current?`, body);
}

/** The form that sends a typed code to /c (app/(public)/c/route.ts). */
export const codeForm = (typed = "") =>
  `<form action="/c" method="get" data-testid="code-form"><label for="code">Code under the QR code on the printout</label>
<input id="code" name="code" value="${escapeHtml(typed.slice(0, 40))}" autocomplete="off" autocapitalize="characters" spellcheck="false" inputmode="text" maxlength="40" required><button type="submit">Check</button></form>`;

/**
 * The one answer for a malformed or unknown token or short code. A mistyped code is the likely
 * cause, so it offers the field again rather than calling the printout untrustworthy.
 */
export function unknownCodeHtml(typed = ""): string {
  return shell(
    "No printout has this code",
    `<div data-testid="check-unknown"><h1 style="margin:0;font-size:1.6rem;line-height:1.2">No printout has this code</h1>
<p>Check the code printed under the QR code (8 letters and digits, like K7QM-2XHD) and type it again.</p>
${codeForm(typed)}</div>
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
