// `npm run bench`: how long an A1 poster with two 10 x 12 grids takes to render, cold (first
// render in a fresh process) and warm (repeated in one process), beside the same cells, texts,
// fonts and page size drawn with raw pdfkit as a baseline; and what a cached download costs
// instead: the render-cache row read back from the project's MariaDB (a bench database).
import { execFileSync } from "node:child_process";
import os from "node:os";
import path from "node:path";
import { performance } from "node:perf_hooks";

// The app renders posters in production mode; React's development build is markedly slower.
Object.assign(process.env, { NODE_ENV: "production" });

const COLD_RUNS = 5;
const WARM_RUNS = 10;
type Engine = "react-pdf" | "pdfkit";

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? (s[m] as number) : ((s[m - 1] as number) + (s[m] as number)) / 2;
};

async function benchInput() {
  const { posterInput, snapshotOf } = await import("../support/poster-fixtures");
  const lookup = (kind: "proximal" | "side", rounding: "up" | "down", familyId: number) => ({
    kind,
    rows: { from: 2.5, to: 4.75, step: 0.25 },
    cols: { from: 2, to: 4.75, step: 0.25 },
    rounding,
    familyId,
  });
  const snapshot = snapshotOf({
    title: "Benchmark poster (illustrative)",
    law: { law: "huo-kassab" },
    lookups: [lookup("proximal", "up", 1), lookup("side", "down", 2)],
    stentPlatformId: 7,
    paper: "A1",
    orientation: "portrait",
    readingDistanceM: 2,
    notes: "Illustrative benchmark chart with invented stock.",
  });
  return posterInput(snapshot);
}

async function pdfkitModules() {
  const [pdfkit, layout, marks, labels, qr, model, snapshot] = await Promise.all([
    import("pdfkit"),
    import("../../lib/poster/layout"),
    import("../../lib/poster/marks"),
    import("../../lib/poster/labels"),
    import("../../lib/poster/qr"),
    import("../../lib/poster/model"),
    import("../../lib/charts/snapshot"),
  ]);
  return { PDFDocument: pdfkit.default, ...layout, ...marks, ...labels, ...qr, ...model, ...snapshot };
}

/** The same page drawn directly with pdfkit: same layout boxes, texts, fonts and QR modules. */
async function renderWithPdfkit(input: Awaited<ReturnType<typeof benchInput>>): Promise<Buffer> {
  const {
    PDFDocument,
    cellBox,
    layoutPoster,
    cellView,
    cornerSymbols,
    formatAxisMm,
    PALETTE,
    lookupTitle,
    QR_QUIET_MODULES,
    qrSymbol,
    layoutInputFor,
    posterLegend,
    snapshotGrids,
  } = await pdfkitModules();
  // The same pure model the poster uses, without loading react-pdf.
  const layout = layoutPoster(layoutInputFor(input.snapshot, input.edition, input.logo !== null));
  const grids = snapshotGrids(input.snapshot);
  const legend = posterLegend(input.snapshot);
  const qr = qrSymbol(input.edition.checkUrl);
  const doc = new PDFDocument({
    size: [layout.page.width, layout.page.height],
    margin: 0,
    info: { Title: input.snapshot.title, CreationDate: new Date(0) },
  });
  const fonts = path.join(process.cwd(), "fonts");
  doc.registerFont("Inter", path.join(fonts, "Inter-Regular.ttf"));
  doc.registerFont("Inter-Bold", path.join(fonts, "Inter-Bold.ttf"));
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on("end", () => resolve(Buffer.concat(chunks))));
  const { fonts: f } = layout;
  doc
    .font("Inter-Bold")
    .fontSize(f.title)
    .fillColor(PALETTE.ink)
    .text(input.snapshot.title, layout.title.x, layout.title.y + f.lab * 1.3, { width: layout.title.width });
  grids.forEach((grid, gi) => {
    const g = layout.grids[gi];
    if (!g) return;
    doc
      .font("Inter-Bold")
      .fontSize(f.gridTitle)
      .text(lookupTitle(grid.kind), g.title.x, g.title.y, { width: g.title.width });
    grid.colAxis.values.forEach((v, j) => {
      doc
        .rect(g.cellsX + j * g.cellWidth, g.cellsY - g.colHeadHeight, g.cellWidth, g.colHeadHeight)
        .fillAndStroke(PALETTE.heading, PALETTE.rule);
      doc
        .fillColor(PALETTE.ink)
        .fontSize(layout.figurePt * 0.56)
        .text(formatAxisMm(v), g.cellsX + j * g.cellWidth, g.cellsY - g.colHeadHeight, {
          width: g.cellWidth,
          align: "center",
          features: ["tnum"],
        });
    });
    grid.cells.forEach((row, i) =>
      row.forEach((cell, j) => {
        const b = cellBox(g, i, j);
        const v = cellView(cell);
        doc.rect(b.x, b.y, b.width, b.height).fillAndStroke(v.background, PALETTE.rule);
        doc
          .fillColor(PALETTE.ink)
          .font("Inter")
          .fontSize(layout.figurePt * 0.34);
        if (v.exact) doc.text(v.exact, b.x + 3, b.y + 2, { lineBreak: false, features: ["tnum"] });
        const corner = cornerSymbols(v);
        if (corner) doc.text(corner, b.x + b.width - 14, b.y + 2, { lineBreak: false });
        doc
          .font("Inter-Bold")
          .fontSize(layout.figurePt)
          .text(v.primary, b.x, b.y + layout.figurePt * 0.33, { width: b.width, align: "center", features: ["tnum"] });
      }),
    );
  });
  doc.font("Inter").fontSize(f.legend);
  legend.forEach((e, i) => {
    const row = layout.legendRows[i];
    if (row) doc.text(`${e.label}. ${e.text}`, row.text.x, row.text.y, { width: row.text.width });
  });
  doc.fontSize(f.caution).text(`CAUTION. ${input.snapshot.caution}`, layout.caution.x + 6, layout.caution.y + 6, {
    width: layout.caution.width - 12,
  });
  const m = layout.qr.width / (qr.size + 2 * QR_QUIET_MODULES);
  for (const r of qr.rects)
    doc.rect(layout.qr.x + (r.x + QR_QUIET_MODULES) * m, layout.qr.y + (r.y + QR_QUIET_MODULES) * m, r.width * m, m);
  doc.fill("#000000");
  doc.end();
  return done;
}

async function renderOnce(engine: Engine, input: Awaited<ReturnType<typeof benchInput>>): Promise<number> {
  const t0 = performance.now();
  if (engine === "react-pdf") {
    const { renderPosterPdf } = await import("@/lib/poster/pdf/render");
    await renderPosterPdf(input);
  } else {
    await renderWithPdfkit(input);
  }
  return performance.now() - t0;
}

async function child(engine: Engine) {
  const t0 = performance.now();
  const input = await benchInput();
  // Load the engine's modules before timing the first render, and report both.
  if (engine === "react-pdf") await import("@/lib/poster/pdf/render");
  else await pdfkitModules();
  const importMs = performance.now() - t0;
  const cpu0 = process.cpuUsage();
  const firstMs = await renderOnce(engine, input);
  const cpu = process.cpuUsage(cpu0);
  // CPU time too: on a shared machine it varies less than wall time (all threads, so GC helpers count).
  console.log(JSON.stringify({ importMs, firstMs, firstCpuMs: (cpu.user + cpu.system) / 1000 }));
}

/** Median time to read a stored render by its key, as a second download does; null without a database. */
async function cachedReadMs(pdf: Buffer): Promise<number | null> {
  const { loadLocalEnv } = await import("../../db/local-env");
  loadLocalEnv();
  const { env } = await import("../../lib/env");
  const local = await import("../../db/local-server");
  const server = local.localServer({ port: env.DB_PORT });
  try {
    const state = await local.start(server);
    const database = "forkwall_bench";
    await local.ensureDatabase(server, { database, user: env.DB_USER, password: env.DB_PASSWORD, fresh: true });
    const { createDb, createPool } = await import("../../db/index");
    const { runMigrations } = await import("../../db/migrate");
    const { sql } = await import("drizzle-orm");
    const pool = createPool(env.DATABASE_URL.replace(/\/[^/]+$/, `/${database}`));
    const db = createDb(pool);
    await runMigrations(db);
    await db.execute(sql`INSERT INTO labs (slug, name) VALUES ('bench', 'Bench lab (illustrative)')`);
    await db.execute(sql`INSERT INTO charts (lab_id, title, definition) VALUES (1, 'Bench', '{}')`);
    await db.execute(
      sql`INSERT INTO editions (lab_id, chart_id, number, snapshot, fingerprint, check_token, short_code) VALUES (1, 1, 1, '{}', REPEAT('a', 64), 'bench-token-0000000000000', 'BENCH000')`,
    );
    await db.execute(sql`INSERT INTO poster_renders (edition_id, render_key, pdf) VALUES (1, REPEAT('b', 64), ${pdf})`);
    const times: number[] = [];
    for (let i = 0; i < 21; i++) {
      const t0 = performance.now();
      const [rows] = await pool.query("SELECT pdf FROM poster_renders WHERE render_key = ?", ["b".repeat(64)]);
      if ((rows as { pdf: Buffer }[])[0]?.pdf.length !== pdf.length) throw new Error("cache row not read back whole");
      if (i > 0) times.push(performance.now() - t0);
    }
    await pool.end();
    await local.rootSql(server, `DROP DATABASE IF EXISTS \`${database}\`;`);
    if (state === "started") await local.stop(server);
    return median(times);
  } catch (err) {
    console.error(`cached read not measured: ${err instanceof Error ? err.message : err}`);
    return null;
  }
}

async function main() {
  const here = path.relative(process.cwd(), new URL(import.meta.url).pathname);
  const results: Record<Engine, { coldFirst: number; coldImport: number; warm: number }> = {} as never;
  const input = await benchInput();
  // The machine is shared: the engines take turns, run by run, so a burst of load from elsewhere
  // falls on both rather than on one.
  const engines = ["react-pdf", "pdfkit"] as const;
  const cold: Record<Engine, { importMs: number; firstMs: number }[]> = { "react-pdf": [], pdfkit: [] };
  for (let i = 0; i < COLD_RUNS; i++)
    for (const engine of engines) {
      const out = execFileSync(process.execPath, ["--import", "tsx", here, "--child", engine], { encoding: "utf8" });
      cold[engine].push(JSON.parse(out.trim().split("\n").pop() as string) as { importMs: number; firstMs: number });
    }
  for (const engine of engines) await renderOnce(engine, input); // warm-up
  const warm: Record<Engine, number[]> = { "react-pdf": [], pdfkit: [] };
  for (let i = 0; i < WARM_RUNS; i++) for (const engine of engines) warm[engine].push(await renderOnce(engine, input));
  for (const engine of engines)
    results[engine] = {
      coldFirst: median(cold[engine].map((c) => c.firstMs)),
      coldImport: median(cold[engine].map((c) => c.importMs)),
      warm: median(warm[engine]),
    };
  const { renderPosterPdf, renderCardPdf } = await import("@/lib/poster/pdf/render");
  const { tilePoster, stampBands } = await import("@/lib/poster/pdf/variants");
  const pdf = await renderPosterPdf(input);
  // The variants, warm, as the PDF route makes them: a tiled set is one poster render plus the
  // sheets; the NOT CURRENT band is one render plus the stamp; the card is its own document.
  const tileOpts = {
    title: input.snapshot.title,
    edition: 3,
    shortCode: "K7QM-2XHD",
    shortUrl: "forkwall.example/c/K7QM-2XHD",
    checkUrl: input.edition.checkUrl,
    band: null,
  };
  const variants: Record<string, () => Promise<unknown>> = {
    single: () => renderPosterPdf(input),
    tiledA4: async () => tilePoster(await renderPosterPdf(input), { ...tileOpts, sheet: "A4" }),
    tiledA3: async () => tilePoster(await renderPosterPdf(input), { ...tileOpts, sheet: "A3" }),
    banded: async () =>
      stampBands(await renderPosterPdf(input), { kind: "not-current", date: "2026-12-02", reason: "bench" }),
    card: () => renderCardPdf(input),
  };
  const times: Record<string, number[]> = {};
  for (const fn of Object.values(variants)) await fn(); // warm-up
  for (let i = 0; i < WARM_RUNS; i++)
    for (const [name, fn] of Object.entries(variants)) {
      const t0 = performance.now();
      await fn();
      (times[name] ??= []).push(performance.now() - t0);
    }
  const [singleMs, tiledA4, tiledA3, banded, cardMs] = ["single", "tiledA4", "tiledA3", "banded", "card"].map((k) =>
    median(times[k] as number[]),
  ) as [number, number, number, number, number];
  const cached = await cachedReadMs(pdf);
  const r = results["react-pdf"];
  const p = results.pdfkit;
  const ms = (x: number) => `${Math.round(x)} ms`;
  const ratio = (a: number, b: number) => `${(a / b).toFixed(2)}×`;
  const load = os
    .loadavg()
    .map((x) => x.toFixed(1))
    .join(", ");
  console.log(
    `\nA1 portrait poster, two 10 x 12 grids; ${os.cpus().length} cores, Node ${process.version}, load average ${load} (1, 5, 15 min)`,
  );
  console.log(
    `cold: median of ${COLD_RUNS} fresh processes (first render; module import shown apart); warm: median of ${WARM_RUNS} renders in one process\n`,
  );
  console.log("| engine | cold first render | module import (cold) | warm render |");
  console.log("|---|---|---|---|");
  console.log(`| react-pdf 4.9 (the poster) | ${ms(r.coldFirst)} | ${ms(r.coldImport)} | ${ms(r.warm)} |`);
  console.log(
    `| raw pdfkit 0.20 (same cells, fonts, texts, QR) | ${ms(p.coldFirst)} | ${ms(p.coldImport)} | ${ms(p.warm)} |`,
  );
  console.log(
    `| ratio react-pdf / pdfkit | ${ratio(r.coldFirst, p.coldFirst)} | ${ratio(r.coldImport, p.coldImport)} | ${ratio(r.warm, p.warm)} |`,
  );
  console.log(
    `\nvariants, warm (median of ${WARM_RUNS}, taking turns with the single poster), against the single poster (${ms(singleMs)}):\n`,
  );
  console.log("| variant | warm | ratio to the single poster |");
  console.log("|---|---|---|");
  console.log(`| tiled on A4 sheets (render + sheets) | ${ms(tiledA4)} | ${ratio(tiledA4, singleMs)} |`);
  console.log(`| tiled on A3 sheets (render + sheets) | ${ms(tiledA3)} | ${ratio(tiledA3, singleMs)} |`);
  console.log(`| NOT CURRENT band (render + stamp) | ${ms(banded)} | ${ratio(banded, singleMs)} |`);
  console.log(`| badge card (two sides) | ${ms(cardMs)} | ${ratio(cardMs, singleMs)} |`);
  console.log(
    `\ncached download: the ${Math.round(pdf.length / 1024)} KB render read back from MariaDB by its key, median of 20: ${cached === null ? "not measured" : `${cached.toFixed(1)} ms`}`,
  );
}

const childAt = process.argv.indexOf("--child");
if (childAt >= 0) await child(process.argv[childAt + 1] as Engine);
else await main();
