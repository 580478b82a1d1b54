"use client";

import Link from "next/link";
import { useEffect, useState } from "react";
import { buttonClass } from "@/components/ui/button";

/** "Create an account" on the prerendered landing page, shown to visitors where sign-up is open. */
export function LandingSignUp() {
  const [open, setOpen] = useState(false);
  useEffect(() => {
    let live = true;
    fetch("/api/v1/header", { cache: "no-store" })
      .then((res) => (res.ok ? res.json() : null))
      .then((body: { user: unknown; signUp?: boolean } | null) => live && setOpen(!body?.user && body?.signUp === true))
      .catch(() => undefined);
    return () => {
      live = false;
    };
  }, []);
  if (!open) return null;
  return (
    <Link href="/sign-up" className={buttonClass("primary")}>
      Create an account and a lab
    </Link>
  );
}
