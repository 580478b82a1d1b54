import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { signOutAction } from "@/lib/auth/actions";
import { currentUser } from "@/lib/auth/session";

export const metadata = { title: "Sign out" };

export default async function SignOutPage() {
  const user = await currentUser().catch(() => null);
  if (!user) {
    return (
      <div>
        <h1 className="text-2xl font-bold">You are signed out</h1>
        <p className="mt-2 text-ink-soft">Nobody is signed in on this browser.</p>
        <Link href="/sign-in" className={buttonClass("primary", "mt-6")}>
          Sign in
        </Link>
      </div>
    );
  }
  return (
    <div>
      <h1 className="text-2xl font-bold">Sign out</h1>
      <p className="mt-2 text-ink-soft">
        You are signed in as <strong>{user.name}</strong> ({user.email}). Signing out ends your sessions on every
        browser; on a shared workstation, always sign out when you leave.
      </p>
      <div className="mt-6 flex flex-wrap gap-3">
        <form action={signOutAction}>
          <button type="submit" className={buttonClass("primary")}>
            Sign out
          </button>
        </form>
        <Link href="/dashboard" className={buttonClass("secondary")}>
          Stay signed in
        </Link>
      </div>
    </div>
  );
}
