import Link from "next/link";

export function Forbidden({ what, slug }: { what: string; slug: string }) {
  return (
    <div role="alert" className="rounded-card border border-line bg-paper-raised p-6">
      <h1 className="text-xl font-semibold">Not available for your role</h1>
      <p className="mt-2 text-ink-soft">
        Your role in this lab does not allow you to {what}. Ask a manager of the lab if you need it.
      </p>
      <Link href={`/labs/${slug}`} className="mt-4 inline-block text-brand-700 underline">
        Back to the lab
      </Link>
    </div>
  );
}
