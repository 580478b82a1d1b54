"use client";

import { useRouter } from "next/navigation";
import { useId, useRef, useState, type DragEvent } from "react";
import { importStockAction, stockImpactAction } from "@/app/(lab)/labs/[slug]/stock/actions";
import { Button } from "@/components/ui/button";
import { UNREACHABLE } from "@/components/ui/use-server-action";
import type { ActionState } from "@/lib/http/action";
import { balloonStockCsv } from "@/lib/stock/export";
import { askImpact, ImpactNotice } from "@/components/stock/impact-gate";
import { ImportPreview } from "@/components/stock/import-preview";
import { formatMm } from "@/lib/stock/format";
import type { ImportResult } from "@/lib/stock/import-plan";
import type { Outdate } from "@/lib/stock/impact";
import { MAX_IMPORT_BYTES, MAX_IMPORT_ROWS } from "@/lib/stock/limits";
import type { BalloonFamilyView } from "@/lib/stock/types";
import { megabytes } from "@/lib/upload-limits";
import { DIAMETER_MAX_MM, DIAMETER_MIN_MM, DIAMETER_STEP_MM } from "@/lib/validation/stock";

type Phase =
  | { step: "idle" }
  | { step: "sending"; file: File; verb: "Checking" | "Applying" }
  | { step: "preview"; file: File; result: ImportResult; outdates: Outdate[] | null }
  | { step: "failed"; file?: File; message: string; issues: string[] }
  | { step: "applied"; file: File; result: ImportResult };

/** Sends the file to the import action: a preview (`revision` absent) or the apply of a previewed plan. */
async function send(slug: string, file: File, revision?: number): Promise<ActionState> {
  const form = new FormData();
  form.set("slug", slug);
  form.set("file", file);
  if (revision === undefined) form.set("dryRun", "1");
  else form.set("revision", String(revision));
  return importStockAction({}, form).catch(() => UNREACHABLE);
}

export function StockImport({ slug, families }: { slug: string; families: BalloonFamilyView[] }) {
  const router = useRouter();
  const inputId = useId();
  const input = useRef<HTMLInputElement>(null);
  const [phase, setPhase] = useState<Phase>({ step: "idle" });
  const [dragging, setDragging] = useState(false);
  const [pasted, setPasted] = useState("");

  const failed = (res: ActionState, file: File): Phase => ({
    step: "failed",
    file,
    message: res.message ?? "The file was not imported; nothing was changed.",
    issues: res.issues ?? [],
  });

  const check = async (file: File) => {
    if (file.size > MAX_IMPORT_BYTES) {
      setPhase({
        step: "failed",
        file,
        message: `${file.name} is ${megabytes(file.size)} MB; the limit is ${megabytes(MAX_IMPORT_BYTES)} MB. Split it into smaller files.`,
        issues: [],
      });
      return;
    }
    setPhase({ step: "sending", file, verb: "Checking" });
    const res = await send(slug, file);
    if (!res.ok) return setPhase(failed(res, file));
    // What applying would do to the wall, shown in the preview before the manager applies.
    const outdates = await askImpact(stockImpactAction, { slug, csv: await file.text() });
    setPhase({ step: "preview", file, result: res.data as ImportResult, outdates });
  };

  const apply = async (file: File, preview: ImportResult) => {
    setPhase({ step: "sending", file, verb: "Applying" });
    const res = await send(slug, file, preview.revision);
    if (!res.ok) return setPhase(failed(res, file));
    setPhase({ step: "applied", file, result: res.data as ImportResult });
    router.refresh();
  };

  const reset = () => {
    setPhase({ step: "idle" });
    if (input.current) input.current.value = "";
  };

  const onDrop = (e: DragEvent) => {
    e.preventDefault();
    setDragging(false);
    const file = e.dataTransfer.files[0];
    if (file) void check(file);
  };

  const download = () => {
    const url = URL.createObjectURL(
      new Blob([`\uFEFF${balloonStockCsv(families)}`], { type: "text/csv;charset=utf-8" }),
    );
    const a = document.createElement("a");
    a.href = url;
    a.download = `${slug}-balloon-stock.csv`;
    a.click();
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  };

  const checkPasted = () => {
    if (pasted.trim()) void check(new File([pasted], "pasted table.csv", { type: "text/csv" }));
  };

  const busy = phase.step === "sending";
  return (
    <section aria-labelledby="stock-import-heading" className="space-y-3">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div>
          <h2 id="stock-import-heading" className="text-xl font-semibold">
            Import balloons and stents from a CSV file
          </h2>
          <p className="max-w-prose text-sm text-ink-soft">
            Check the file first: you see every change before anything is saved. A file lists each of its families&apos;
            whole range; sizes of those families that the file leaves out are marked out of stock. Families and
            platforms the file does not mention stay as they are.{" "}
            <a href="/examples/stock-example.csv" download className="text-brand-700 underline">
              Example file (invented data)
            </a>
          </p>
        </div>
        <Button type="button" variant="secondary" onClick={download} disabled={families.length === 0}>
          Download current balloons as CSV
        </Button>
      </div>

      <div
        onDragOver={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={onDrop}
        className={`rounded-card border-2 border-dashed px-6 py-8 text-center ${dragging ? "border-brand-500 bg-brand-50" : "border-line-strong bg-paper-raised"}`}
      >
        <label htmlFor={inputId} className="block font-medium">
          Drop a CSV file here, or choose one
        </label>
        <input
          ref={input}
          id={inputId}
          type="file"
          accept=".csv,text/csv,text/plain"
          disabled={busy}
          onChange={(e) => {
            const file = e.target.files?.[0];
            if (file) void check(file);
          }}
          className="mx-auto mt-3 block w-full max-w-full text-sm file:mr-3 file:rounded-md file:border file:border-line-strong file:bg-white file:px-3 file:py-1.5 file:font-semibold"
        />
        <p className="mt-2 text-xs text-ink-faint">
          UTF-8 text, up to {megabytes(MAX_IMPORT_BYTES)} MB and {MAX_IMPORT_ROWS.toLocaleString("en")} lines.
        </p>
      </div>

      <div className="space-y-2">
        <label htmlFor={`${inputId}-paste`} className="block font-medium">
          Or paste a table (from a spreadsheet, with its header row)
        </label>
        <textarea
          id={`${inputId}-paste`}
          rows={4}
          value={pasted}
          disabled={busy}
          onChange={(e) => setPasted(e.target.value)}
          className="w-full rounded-md border border-line-strong bg-white px-3 py-2 font-mono text-xs"
        />
        <Button type="button" variant="secondary" onClick={checkPasted} disabled={busy || !pasted.trim()}>
          Check pasted table
        </Button>
      </div>

      <details className="rounded-md border border-line bg-paper-raised px-4 py-2 text-sm">
        <summary className="cursor-pointer font-medium">What the file looks like</summary>
        <div className="mt-2 space-y-2 text-ink-soft [overflow-wrap:anywhere]">
          <p>
            First line: the column names <code>family,compliance,diameter_mm,in_stock</code>, optionally followed by{" "}
            <code>nominal_atm,rbp_atm,growth_at_rbp_mm</code>. Then one line per balloon size. Commas or semicolons
            separate the fields; a decimal comma (2,75) works in semicolon files, and in comma files when the number is
            quoted (&quot;2,75&quot;).
          </p>
          <ul className="list-disc pl-5">
            <li>
              <code>compliance</code>: <code>nc</code> (non-compliant) or <code>sc</code> (semi-compliant).
            </li>
            <li>
              <code>diameter_mm</code>: {formatMm(DIAMETER_MIN_MM)} to {formatMm(DIAMETER_MAX_MM)} in steps of{" "}
              {formatMm(DIAMETER_STEP_MM)}; each diameter once per family.
            </li>
            <li>
              <code>in_stock</code>: yes, no, y, n, true, false, 1 or 0 (any letter case).
            </li>
            <li>
              Stent sizes: a line naming a <code>platform</code> (leave <code>family</code> empty) with the nominal{" "}
              <code>diameter_mm</code> and <code>max_post_dilatation_mm</code>; <code>in_stock</code> no removes that
              size, and sizes the file leaves out stay.
            </li>
            <li>
              A new family needs its nominal and rated burst pressures (atm) on at least one of its lines; existing
              families may leave them empty to keep what is recorded.
            </li>
          </ul>
          <pre className="overflow-x-auto rounded bg-paper-sunk p-2 text-xs">
            {
              "family;compliance;diameter_mm;in_stock;nominal_atm;rbp_atm;growth_at_rbp_mm\nNC family A (illustrative);nc;2,50;yes;12;20;0,20\nNC family A (illustrative);nc;2,75;no;;;"
            }
          </pre>
        </div>
      </details>

      <div aria-live="polite" className="space-y-3">
        {phase.step === "sending" ? (
          <div role="status" className="rounded-md border border-line bg-paper-raised px-4 py-3">
            <p className="font-medium">
              {phase.verb} {phase.file.name}…{" "}
              {phase.verb === "Checking" ? "comparing with the current stock" : "saving"}
            </p>
            <progress className="mt-2 w-full" aria-label={`${phase.verb} ${phase.file.name}`} />
          </div>
        ) : null}

        {phase.step === "failed" ? (
          <div role="alert" className="rounded-md border border-danger/40 bg-danger-soft px-4 py-3 text-sm">
            <p className="font-semibold text-danger">
              <span aria-hidden>⚠ </span>
              {phase.file ? `${phase.file.name}: ` : ""}
              {phase.message}
            </p>
            {phase.issues.length ? (
              <ul
                className="mt-2 max-h-72 list-disc space-y-1 overflow-y-auto pl-5 text-ink"
                aria-label="Problems in the file"
              >
                {phase.issues.map((issue, i) => (
                  <li key={i}>{issue}</li>
                ))}
              </ul>
            ) : null}
            <Button type="button" variant="secondary" className="mt-3" onClick={reset}>
              Choose another file
            </Button>
          </div>
        ) : null}

        {phase.step === "preview" ? (
          <ImportPreview
            result={phase.result}
            fileName={phase.file.name}
            onApply={() => apply(phase.file, phase.result)}
            onCancel={reset}
            impact={phase.outdates ? <ImpactNotice outdates={phase.outdates} /> : null}
          />
        ) : null}

        {phase.step === "applied" ? (
          <div role="status" className="rounded-md border border-ok/40 bg-ok-soft px-4 py-3 text-sm">
            <p className="font-semibold text-ok">
              <span aria-hidden>✓ </span>
              {phase.result.applied
                ? `Imported ${phase.file.name}: ${phase.result.summary}. Stock revision ${phase.result.revision}.`
                : `${phase.file.name} matches the current stock; nothing was changed.`}
            </p>
            <Button type="button" variant="secondary" className="mt-3" onClick={reset}>
              Import another file
            </Button>
          </div>
        ) : null}
      </div>
    </section>
  );
}
