import { formatDateTime } from "@/lib/format/dates";

type StateEdition = {
  number: number;
  status: "draft" | "returned" | "approved" | "superseded" | "withdrawn";
  approvedAt: Date | null;
  approvedByName: string | null;
  reviewBy: Date | null;
  rejectionReason: string | null;
  withdrawnAt: Date | null;
  withdrawalReason: string | null;
  supersededAt: Date | null;
};

/** Where the edition stands now, in words, for any state but a draft awaiting decision. */
export function EditionState({
  edition: e,
  againstNumber,
  timeZone,
}: {
  edition: StateEdition;
  againstNumber: number | null;
  timeZone: string;
}) {
  const at = (d: Date | null) => (d ? ` on ${formatDateTime(d, timeZone)}` : "");
  const replaced =
    againstNumber === null ? " It replaced no earlier edition." : ` It replaced edition ${againstNumber}.`;
  let text: string;
  switch (e.status) {
    case "draft":
      return null;
    case "returned":
      text = `Edition ${e.number} was sent back: it can no longer be approved. Reason: ${e.rejectionReason ?? "not recorded"}`;
      break;
    case "approved":
      text = `Edition ${e.number} is approved${e.approvedByName ? ` by ${e.approvedByName}` : ""}${at(e.approvedAt)}${e.reviewBy ? `, to be reviewed by ${formatDateTime(e.reviewBy, timeZone)}` : ""}.${replaced}`;
      break;
    case "superseded":
      text = `Edition ${e.number} was approved${e.approvedByName ? ` by ${e.approvedByName}` : ""}${at(e.approvedAt)} and superseded by a newer edition${at(e.supersededAt)}.${replaced}`;
      break;
    case "withdrawn":
      text = `Edition ${e.number} was withdrawn${at(e.withdrawnAt)}. Reason: ${e.withdrawalReason ?? "not recorded"}`;
      break;
  }
  return (
    <p
      role="status"
      data-testid="edition-state"
      className="rounded-card border border-line bg-paper-raised p-4 text-sm font-medium"
    >
      {text} There is nothing to sign off.
    </p>
  );
}
