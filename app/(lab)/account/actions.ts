"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { runAction, type ActionPayload, type ActionState } from "@/lib/http/action";
import { changeName, changePassword, leaveLab, requestEmailChange } from "@/lib/ops/account-settings";

export async function changeNameAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, values) => {
    const { changed } = await changeName(caller, { name: values.name });
    revalidatePath("/account");
    return { ok: true, message: changed ? "Your name was saved." : "That is already your name." };
  });
}

export async function changeEmailAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(
    payload,
    async (caller, values) => {
      const { pendingEmail } = await requestEmailChange(caller, {
        email: values.email,
        currentPassword: values.currentPassword,
      });
      revalidatePath("/account");
      return {
        ok: true,
        message: `A link is on its way to ${pendingEmail}. Your address changes when you open it; until then it stays as it is.`,
        values: { email: pendingEmail },
      };
    },
    { secret: ["currentPassword"] },
  );
}

export async function changePasswordAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  let done = false;
  const state = await runAction(
    payload,
    async (caller, values) => {
      await changePassword(caller, {
        currentPassword: values.currentPassword,
        password: values.password,
        confirm: values.confirm,
      });
      done = true;
      return { ok: true };
    },
    { secret: ["currentPassword", "password", "confirm"] },
  );
  // Every session ended with the old password: sign in again with the new one.
  if (done) redirect("/sign-in?notice=password-changed");
  return state;
}

export async function leaveLabAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, values) => {
    await leaveLab(caller, { lab: String(values.slug ?? "") });
    revalidatePath("/account");
    return { ok: true, message: "You have left the lab." };
  });
}
