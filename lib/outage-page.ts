// The page proxy.ts answers with (status 503) while the database cannot be reached. It is plain
// HTML with its own styles, in the product's colours (tailwind.config.ts), because the app's
// pages cannot set a 503 status and cannot render their data without the database.
export type OutageKind = "page" | "check";

const TEXT: Record<OutageKind, { badge: string; title: string; body: string[] }> = {
  page: {
    badge: "Temporarily unavailable",
    title: "Forkwall cannot reach its database right now",
    body: [
      "Please try again in a minute. Nothing you were doing has been half-saved: a change is either stored whole or not at all.",
      "The calculator works without the database.",
    ],
  },
  check: {
    badge: "Unverified",
    title: "This printout cannot be verified right now",
    body: [
      "Forkwall cannot reach its database, so it cannot say whether this copy is current. Treat the printout as unverified: do not rely on its numbers until a check succeeds.",
      "Try again in a minute by reloading this page.",
    ],
  },
};

const STYLE = `
*{box-sizing:border-box}
body{margin:0;background:#f7f8f6;color:#17212b;font-family:system-ui,-apple-system,"Segoe UI",sans-serif;line-height:1.5}
header{border-bottom:1px solid #d5dbdf;background:#fff}
header div,main{max-width:72rem;margin:0 auto;padding:0.75rem 1.5rem}
header a{display:inline-flex;align-items:center;gap:0.5rem;color:#113d48;font-weight:700;font-size:1.125rem;text-decoration:none}
main{padding-top:2rem}
.card{max-width:36rem;margin:0 auto;border-radius:0.75rem;padding:1.5rem}
.page{border:1px solid rgba(138,83,0,.4);background:#fdf1dc}
.check{border:2px solid #a3261f;background:#fbe9e7}
.badge{margin:0;font-size:.875rem;font-weight:600;text-transform:uppercase;letter-spacing:.05em}
.page .badge{color:#8a5300}.check .badge{color:#a3261f}
h1{margin:.25rem 0 0;font-size:1.25rem;font-weight:600}
p{margin:.5rem 0 0}
a.more{display:inline-block;margin-top:1rem;color:#164f5d}
`;

const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

export function outageHtml(kind: OutageKind): string {
  const t = TEXT[kind];
  const more = kind === "page" ? `<a class="more" href="/calculator">Open the calculator</a>` : "";
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex"><meta name="theme-color" content="#164f5d">
<title>${escape(t.title)} · Forkwall</title><link rel="icon" href="/icon.svg" type="image/svg+xml"><style>${STYLE}</style></head>
<body><header><div><a href="/"><img src="/icon.svg" alt="" width="24" height="24">Forkwall</a></div></header>
<main id="main"><div class="card ${kind}" role="alert"><p class="badge">${escape(t.badge)}</p><h1>${escape(t.title)}</h1>
${t.body.map((p) => `<p>${escape(p)}</p>`).join("\n")}
${more}</div></main></body></html>
`;
}
