/** What the last save said: a status when it worked, an alert when it did not. */
export function SaveNotice({ notice }: { notice: { ok: boolean; text: string } | null }) {
  if (!notice) return null;
  return (
    <p
      role={notice.ok ? "status" : "alert"}
      className={`rounded-md border px-3 py-2 text-sm ${notice.ok ? "border-ok/40 bg-ok-soft" : "border-danger/40 bg-danger-soft text-danger"}`}
    >
      {notice.text}
    </p>
  );
}
