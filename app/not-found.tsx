import Link from "next/link";

export default function NotFound() {
  return (
    <div className="py-12">
      <h1 className="text-2xl font-bold">Not found</h1>
      <p className="mt-2 text-ink-soft">That page does not exist, or you are not a member of the lab it belongs to.</p>
      <Link href="/" className="mt-4 inline-block text-brand-700 underline">
        Go to the start page
      </Link>
    </div>
  );
}
