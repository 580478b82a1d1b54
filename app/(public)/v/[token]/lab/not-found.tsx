import { Caution } from "@/components/ui/caution";

// A mistyped code is the likely cause: offer the field again (the form sends it to /c).
export default function CheckNotFound() {
  return (
    <div className="mx-auto max-w-xl" data-testid="check-unknown">
      <h1 className="text-2xl font-semibold">No printout has this code</h1>
      <p className="mt-2 text-base text-ink">
        Check the code printed under the QR code (8 letters and digits, like K7QM-2XHD) and type it again.
      </p>
      <form action="/c" method="get" className="mt-4 flex flex-wrap items-end gap-2">
        <label htmlFor="code" className="w-full font-semibold">
          Code under the QR code on the printout
        </label>
        <input
          id="code"
          name="code"
          required
          maxLength={40}
          autoComplete="off"
          autoCapitalize="characters"
          spellCheck={false}
          className="min-h-11 min-w-0 flex-1 rounded-md border border-ink-faint px-3 font-mono uppercase"
        />
        <button type="submit" className="min-h-11 rounded-md bg-brand-700 px-4 font-semibold text-white">
          Check
        </button>
      </form>
      <Caution className="mt-8" />
    </div>
  );
}
