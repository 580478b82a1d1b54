"use client";

import { useRef, useState } from "react";
import { removeChartLogoAction, setChartLogoAction } from "@/app/(lab)/labs/[slug]/charts/actions";
import { Button } from "@/components/ui/button";
import { useServerAction } from "@/components/ui/use-server-action";
import { LOGO_MAX_BYTES, LOGO_TOO_LARGE_HINT, megabytes, tooLargeMessage } from "@/lib/upload-limits";

const LIMIT = `PNG or JPEG, at most ${megabytes(LOGO_MAX_BYTES)} MB`;

/** Upload or remove the lab logo printed on this chart's posters. */
export function LogoField({
  slug,
  chartId,
  logoSha256,
  canEdit,
}: {
  slug: string;
  chartId: number;
  logoSha256: string | null;
  canEdit: boolean;
}) {
  const input = useRef<HTMLInputElement>(null);
  const { run, pending: busy, state: sent } = useServerAction(setChartLogoAction);
  const [tooLarge, setTooLarge] = useState<string | null>(null);
  const state = tooLarge ? { ok: false, message: tooLarge } : sent;
  const url = `/api/v1/charts/${chartId}/logo`;

  async function upload(file: File) {
    // Refused here, before sending: a file over the limit would also exceed the request limit.
    setTooLarge(file.size > LOGO_MAX_BYTES ? tooLargeMessage(file.size, LOGO_MAX_BYTES, LOGO_TOO_LARGE_HINT) : null);
    if (file.size > LOGO_MAX_BYTES) return;
    const form = new FormData();
    form.set("slug", slug);
    form.set("chartId", String(chartId));
    form.set("file", file);
    const res = await run(form);
    if (res.ok && input.current) input.current.value = "";
  }

  return (
    <section aria-labelledby="logo-h" className="mt-8 rounded-card border border-line bg-paper-raised p-4">
      <h2 id="logo-h" className="font-semibold">
        Lab logo on the poster
      </h2>
      <div className="mt-2 flex flex-wrap items-center gap-4">
        {logoSha256 ? (
          // eslint-disable-next-line @next/next/no-img-element -- served from the app's own API with the lab's access check
          <img
            src={`${url}?v=${logoSha256.slice(0, 12)}`}
            alt="Current lab logo"
            className="h-16 max-w-48 rounded border border-line bg-white object-contain p-1"
          />
        ) : (
          <p className="text-sm text-ink-soft">No logo: the poster prints the lab name only.</p>
        )}
        {canEdit ? (
          <div className="flex flex-wrap items-center gap-2">
            <label className="min-w-0 max-w-full text-sm font-medium">
              <span className="sr-only">Logo file ({LIMIT})</span>
              <input
                ref={input}
                type="file"
                accept="image/png,image/jpeg"
                disabled={busy}
                onChange={(e) => {
                  const file = e.target.files?.[0];
                  if (file) void upload(file);
                }}
                className="w-full max-w-full text-sm file:mr-2 file:rounded-md file:border file:border-line-strong file:bg-white file:px-3 file:py-1.5"
              />
            </label>
            {logoSha256 ? (
              <Button
                variant="ghost"
                disabled={busy}
                onClick={() => {
                  setTooLarge(null);
                  void run({ slug, chartId }, removeChartLogoAction);
                }}
              >
                Remove logo
              </Button>
            ) : null}
          </div>
        ) : null}
      </div>
      <p className="mt-1 text-xs text-ink-faint">{LIMIT}; the file&apos;s type is checked from its contents.</p>
      {busy ? <p className="mt-2 text-sm text-ink-soft">Uploading…</p> : null}
      {state?.message && !busy ? (
        <p role={state.ok ? "status" : "alert"} className={`mt-2 text-sm ${state.ok ? "text-ok" : "text-danger"}`}>
          {state.message}
        </p>
      ) : null}
    </section>
  );
}
