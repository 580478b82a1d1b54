"use client";

import { useState } from "react";
import { setStaleMailAction } from "@/app/(lab)/labs/[slug]/actions";
import { useServerAction } from "@/components/ui/use-server-action";

export function StaleMailToggle({ slug, initial }: { slug: string; initial: boolean }) {
  const [on, setOn] = useState(initial);
  const { run, pending, state } = useServerAction(setStaleMailAction, { refresh: false });
  const message = state?.message;
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
            void run({ slug, on: next }).then((res) => res.ok || setOn(!next));
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
