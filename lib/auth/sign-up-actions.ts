"use server";

import { redirect } from "next/navigation";
import { after } from "next/server";
import { formValues, runAction, type ActionPayload, type ActionState } from "@/lib/http/action";
import { log } from "@/lib/log";
import { admitSignUp, completeSignUp, resendVerification, verifyEmail } from "@/lib/ops/sign-up";
import { verifyEmailSchema } from "@/lib/validation/account";
import { requestAddress } from "./request-address";

/** The same answer for every address; the account (or the "already have one" e-mail) follows after. */
export async function signUpAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(
    payload,
    async (_caller, values) => {
      const ip = await requestAddress();
      const input = await admitSignUp({ name: values.name, email: values.email, password: values.password }, { ip });
      after(() =>
        completeSignUp(input, { ip }).catch((err: unknown) =>
          log.error({ err, operation: "account.sign_up" }, "sign-up failed"),
        ),
      );
      redirect(`/check-email?${new URLSearchParams({ email: input.email })}`);
    },
    { secret: ["password"] },
  );
}

/** A new confirmation link for the signed-in, unconfirmed person (limited per hour). */
export async function resendVerificationAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller) => {
    const { email } = await resendVerification(caller);
    return { ok: true, message: `A new link is on its way to ${email}. Older links no longer work.` };
  });
}

/** Uses a confirmation link (the token in it is the credential). */
export async function verifyEmailAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  let to: string | null = null;
  const state = await runAction(payload, async (caller, values) => {
    const parsed = verifyEmailSchema.safeParse(formValues(values));
    if (!parsed.success) return { ok: false, message: "This confirmation link is not valid." };
    const done = await verifyEmail({ token: parsed.data.token });
    const next = done.changedFrom ? "/account" : "/labs/new";
    to =
      caller.kind === "user" && caller.user.id === done.userId
        ? next
        : `/sign-in?${new URLSearchParams({ notice: "verified", email: done.email, callbackUrl: next })}`;
    return { ok: true };
  });
  if (to) redirect(to);
  return state;
}
