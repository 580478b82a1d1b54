"use server";

import { AuthError } from "next-auth";
import { signIn } from "./config";

export type SignInState = { error?: string; email?: string };

export async function signInAction(_prev: SignInState, form: FormData): Promise<SignInState> {
  const email = String(form.get("email") ?? "").trim();
  const password = String(form.get("password") ?? "");
  const callbackUrl = String(form.get("callbackUrl") ?? "/dashboard");
  if (!email || !password) return { error: "Enter your e-mail address and password.", email };
  try {
    await signIn("credentials", { email, password, redirectTo: callbackUrl.startsWith("/") && !callbackUrl.startsWith("//") ? callbackUrl : "/dashboard" });
    return {};
  } catch (err) {
    if (err instanceof AuthError) {
      const code = (err as AuthError & { code?: string }).code;
      if (code === "throttled") return { error: "Too many failed attempts. Wait a few minutes, then try again.", email };
      return { error: "That e-mail address and password do not match an account.", email };
    }
    throw err;
  }
}
