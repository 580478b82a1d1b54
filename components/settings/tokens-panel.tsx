"use client";

import { useActionState } from "react";
import { createTokenAction, reissueTokenAction, revokeTokenAction } from "@/app/(lab)/labs/[slug]/settings/actions";
import type { ActionState } from "@/lib/http/action";
import { formatDateTime } from "@/lib/format/dates";
import { TOKEN_NAME_MAX, TOKEN_SCOPES, type TokenScope } from "@/lib/validation/tokens";
import { CheckboxField, TextField } from "@/components/ui/field";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";
import { useServerAction } from "@/components/ui/use-server-action";
import { useConfirm } from "@/components/ui/dialog";

export type TokenRow = {
  id: number;
  name: string;
  scopes: TokenScope[];
  hint: string;
  createdAt: Date;
  createdByName: string | null;
  lastUsedAt: Date | null;
  disabledAt: Date | null;
  disabledReason: string | null;
};

const SCOPE_LABELS: Record<TokenScope, string> = {
  "stock:read": "Read stock (stock:read)",
  "stock:write": "Change stock (stock:write)",
};

type Secret = { token: string; name: string };

/** Machine tokens of the lab: create (shown once), list with last use, revoke, re-issue disabled ones. Managers only. */
export function TokensPanel({ slug, tokens, timeZone }: { slug: string; tokens: TokenRow[]; timeZone: string }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(createTokenAction, {});
  const revoke = useServerAction(revokeTokenAction);
  const [ask, dialog] = useConfirm();
  const reissued = revoke.state?.ok ? (revoke.state.data as Secret | undefined) : undefined;
  const created = reissued ?? (state.ok ? (state.data as Secret | undefined) : undefined);
  const disabled = tokens.filter((t) => t.disabledAt);
  return (
    <div className="space-y-6">
      {dialog}
      <form action={action} className="grid gap-4" noValidate aria-busy={pending} aria-label="Create a token">
        <input type="hidden" name="slug" value={slug} />
        <TextField
          id="token-name"
          label="Token name"
          name="name"
          maxLength={TOKEN_NAME_MAX}
          hint="Say which system uses it, e.g. “inventory system”; the audit log names its changes “token <name>”."
          defaultValue={state.ok ? "" : String(state.values?.name ?? "")}
          error={state.fieldErrors?.name}
        />
        <fieldset>
          <legend className="text-sm font-medium">What it may do</legend>
          <div className="mt-2 space-y-2">
            {TOKEN_SCOPES.map((s) => (
              <CheckboxField
                key={s}
                id={`token-scope-${s.replace(":", "-")}`}
                label={SCOPE_LABELS[s]}
                name="scopes"
                value={s}
                defaultChecked={s === "stock:read"}
              />
            ))}
          </div>
          {state.fieldErrors?.scopes ? (
            <p className="mt-1 text-sm text-danger">
              <span aria-hidden>⚠ </span>
              {state.fieldErrors.scopes}
            </p>
          ) : null}
        </fieldset>
        <div>
          <button type="submit" disabled={pending} className={buttonClass("primary")}>
            {pending ? "Creating…" : "Create token"}
          </button>
        </div>
        <FormStatus ok={state.ok} message={state.message} />
      </form>

      {created ? (
        <div className="rounded-card border border-warn/50 bg-paper-raised p-4" data-testid="new-token">
          <label htmlFor="new-token-value" className="block text-sm font-semibold">
            The token for “{created.name}” (shown only now)
          </label>
          <input
            id="new-token-value"
            readOnly
            value={created.token}
            onFocus={(e) => e.currentTarget.select()}
            className="mt-2 w-full rounded-md border border-line-strong bg-white px-3 py-2 font-mono text-sm"
          />
          <p className="mt-2 text-sm text-ink-soft">
            Store it in the inventory system now. Forkwall keeps only a fingerprint of it and cannot show it again; if
            it is lost, revoke it and create another.
          </p>
        </div>
      ) : null}

      <FormStatus ok={revoke.state?.ok} message={revoke.state?.message} />
      {disabled.length > 0 ? (
        <p className="rounded-card border border-warn/50 bg-paper-raised p-4 text-sm" data-testid="tokens-disabled">
          <span aria-hidden>⚠ </span>
          {disabled.length === 1 ? "One token is" : `${disabled.length} tokens are`} disabled because the person who
          created {disabled.length === 1 ? "it" : "them"} left the lab or stopped being a manager. Requests with{" "}
          {disabled.length === 1 ? "it" : "them"} are refused. Re-issue to get a new secret with the same name and
          scopes, then give it to the system that uses it; or revoke.
        </p>
      ) : null}
      {tokens.length === 0 ? (
        <p className="text-sm text-ink-soft">No tokens yet.</p>
      ) : (
        <ul className="divide-y divide-line rounded-card border border-line bg-paper-raised" aria-label="Tokens">
          {tokens.map((t) => (
            <li
              key={t.id}
              className="flex flex-wrap items-start justify-between gap-3 p-4"
              data-testid={`token-${t.name}`}
            >
              <div className="min-w-0">
                <p className="break-words font-medium">{t.name}</p>
                <p className="text-sm text-ink-soft">
                  <span className="font-mono">{t.hint}…</span> · {t.scopes.join(", ")}
                </p>
                <p className="text-xs text-ink-faint">
                  Created {formatDateTime(t.createdAt, timeZone)}
                  {t.createdByName ? ` by ${t.createdByName}` : ""} · last used{" "}
                  {t.lastUsedAt ? formatDateTime(t.lastUsedAt, timeZone) : "never"}
                </p>
                {t.disabledAt ? (
                  <p className="mt-1 text-sm font-medium text-danger">
                    Disabled {formatDateTime(t.disabledAt, timeZone)}. {t.disabledReason}
                  </p>
                ) : null}
              </div>
              <div className="flex flex-wrap gap-2">
                {t.disabledAt ? (
                  <button
                    type="button"
                    disabled={revoke.pending}
                    className={buttonClass("primary")}
                    onClick={() => void revoke.run({ slug, tokenId: t.id }, reissueTokenAction)}
                  >
                    Re-issue<span className="sr-only"> {t.name}</span>
                  </button>
                ) : null}
                <button
                  type="button"
                  disabled={revoke.pending}
                  className={buttonClass("secondary")}
                  onClick={async () => {
                    const ok = await ask({
                      title: `Revoke the token "${t.name}"?`,
                      body: (
                        <p>
                          Every request with it is refused from now on ({t.scopes.join(", ")}). This cannot be undone.
                        </p>
                      ),
                      confirm: "Revoke token",
                      danger: true,
                    });
                    if (ok) void revoke.run({ slug, tokenId: t.id });
                  }}
                >
                  Revoke<span className="sr-only"> {t.name}</span>
                </button>
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
