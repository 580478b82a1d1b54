"use client";

import { useRouter } from "next/navigation";
import { useRef, useState } from "react";
import { Button } from "@/components/ui/button";

/** Upload or remove the lab logo printed on this chart's posters (PNG or JPEG, at most 1 MB). */
export function LogoField({
  chartId,
  logoSha256,
  canEdit,
}: {
  chartId: number;
  logoSha256: string | null;
  canEdit: boolean;
}) {
  const router = useRouter();
  const input = useRef<HTMLInputElement>(null);
  const [state, setState] = useState<{ busy: boolean; error?: string; ok?: string }>({ busy: false });
  const url = `/api/v1/charts/${chartId}/logo`;

  async function send(method: "PUT" | "DELETE", file?: File) {
    setState({ busy: true });
    const body = file ? new FormData() : undefined;
    if (file && body) body.set("file", file);
    const res = await fetch(url, { method, body });
    if (!res.ok) {
      const err = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
      setState({ busy: false, error: err?.error?.message ?? `The logo was not saved (HTTP ${res.status}).` });
      return;
    }
    setState({ busy: false, ok: method === "PUT" ? "Logo saved. New editions will print it." : "Logo removed." });
    if (input.current) input.current.value = "";
    router.refresh();
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
            <label className="text-sm font-medium">
              <span className="sr-only">Logo file (PNG or JPEG, at most 1 MB)</span>
              <input
                ref={input}
                type="file"
                accept="image/png,image/jpeg"
                disabled={state.busy}
                onChange={(e) => {
                  const file = e.target.files?.[0];
                  if (file) void send("PUT", file);
                }}
                className="text-sm file:mr-2 file:rounded-md file:border file:border-line-strong file:bg-white file:px-3 file:py-1.5"
              />
            </label>
            {logoSha256 ? (
              <Button variant="ghost" disabled={state.busy} onClick={() => void send("DELETE")}>
                Remove logo
              </Button>
            ) : null}
          </div>
        ) : null}
      </div>
      <p className="mt-1 text-xs text-ink-faint">
        PNG or JPEG, at most 1 MB; the file&apos;s type is checked from its contents.
      </p>
      {state.busy ? <p className="mt-2 text-sm text-ink-soft">Uploading…</p> : null}
      {state.error ? (
        <p role="alert" className="mt-2 text-sm text-danger">
          {state.error}
        </p>
      ) : null}
      {state.ok ? (
        <p role="status" className="mt-2 text-sm text-ok">
          {state.ok}
        </p>
      ) : null}
    </section>
  );
}
