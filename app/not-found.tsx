import Link from "next/link";
import { buttonClass } from "@/components/ui/button";

export const metadata = { title: "Not found", robots: { index: false } };

export default function NotFound() {
  return (
    <div className="mx-auto max-w-xl rounded-card border border-line bg-paper-raised p-6">
      <p className="text-sm font-semibold uppercase tracking-wide text-ink-faint">404</p>
      <h1 className="mt-1 text-2xl font-bold">Not found</h1>
      <p className="mt-2 text-ink-soft">That page does not exist, or you are not a member of the lab it belongs to.</p>
      <div className="mt-4 flex flex-wrap gap-2">
        <Link href="/" className={buttonClass("primary")}>
          Go to the start page
        </Link>
        <Link href="/dashboard" className={buttonClass("secondary")}>
          Your labs
        </Link>
      </div>
    </div>
  );
}
