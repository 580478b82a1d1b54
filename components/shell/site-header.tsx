import Link from "next/link";
import { HeaderAccount } from "./header-account";

/** The site header: static, so pages that depend on nobody can be prerendered; the account part loads after. */
export function SiteHeader() {
  return (
    <header className="relative border-b border-line bg-paper-raised">
      <div className="mx-auto flex w-full max-w-page items-center gap-2 px-3 py-1 sm:gap-4 sm:px-gutter">
        <Link href="/" className="flex min-h-11 items-center gap-2 text-lg font-bold tracking-tight text-brand-800">
          <span
            aria-hidden
            className="inline-block h-6 w-6 rounded bg-brand-700 [clip-path:polygon(50%_0,100%_100%,62%_100%,50%_70%,38%_100%,0_100%)]"
          />
          Forkwall
        </Link>
        <HeaderAccount />
      </div>
    </header>
  );
}
