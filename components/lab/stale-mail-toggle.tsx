"use client";

import { useState, useTransition } from "react";
import { setStaleMailAction } from "@/app/(lab)/labs/[slug]/actions";

export function StaleMailToggle({ slug, initial }: { slug: string; initial: boolean }) {
  const [on, setOn] = useState(initial);
  const [message, setMessage] = useState<string | null>(null);
  const [pending, start] = useTransition();
  return (
    <div className="flex flex-wrap items-center gap-3">
      <label className="inline-flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          checked={on}
          disabled={pending}
          onChange={(e) => {
            const next = e.target.checked;
            setOn(next);
            start(async () => {
              const res = await setStaleMailAction(slug, next);
              if (!res.ok) setOn(!next);
              setMessage(res.message ?? null);
            });
          }}
          className="h-4 w-4"
        />
        E-mail me when printed copies on the walls go stale
      </label>
      {message ? (
        <span role="status" className="text-sm text-ink-soft">
          {message}
        </span>
      ) : null}
    </div>
  );
}
