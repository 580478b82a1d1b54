import Link from "next/link";
import { LandingSignUp } from "@/components/public/landing-sign-up";
import { buttonClass } from "@/components/ui/button";

// Prerendered: nothing here depends on the visitor (the header's account part loads separately).
export const dynamic = "force-static";

export default function LandingPage() {
  return (
    <div className="py-10">
      <h1 className="max-w-3xl text-4xl font-bold tracking-tight text-brand-800">
        Forkwall turns your cath lab&apos;s own balloon stock and chosen bifurcation law into approved wall charts, and
        tells you when a printed copy has gone stale.
      </h1>
      <p className="mt-6 max-w-2xl text-lg text-ink-soft">
        Enter two vessel diameters measured by QCA, IVUS or OCT; read the proximal optimisation or side-branch balloon
        that your shelf actually holds. Every poster carries a QR code that opens a live check of whether that printout
        still matches your stock and rules.
      </p>
      <div className="mt-8 flex flex-wrap gap-3">
        <LandingSignUp />
        <Link href="/sign-in" className={buttonClass("primary")}>
          Sign in to your lab
        </Link>
        <Link href="/calculator" className={buttonClass("secondary")}>
          Open the calculator
        </Link>
      </div>
      <p className="mt-12 max-w-2xl text-sm text-ink-faint">
        A reference aid only: operator judgement, local protocol and licensed practice rule.
      </p>
    </div>
  );
}
