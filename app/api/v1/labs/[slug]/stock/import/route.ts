import { api } from "@/lib/http/route";
import { authorize } from "@/lib/ops/access";
import { importBalloonCsv } from "@/lib/ops/stock";
import { CSV_TOO_LARGE_HINT } from "@/lib/stock/file";
import { MAX_IMPORT_BYTES } from "@/lib/stock/limits";
import { readUploadedFile } from "@/lib/upload";

/** POST multipart `file` (balloon CSV); ?dryRun=1 previews, otherwise applies; ?revision=n refuses if stock changed since the preview. */
export const POST = api<{ slug: string }>(async ({ req, caller, params, query }) => {
  // The role is checked before the body is read: a refused caller gets 401/403/404, never 400 or 413.
  await authorize(caller, { lab: params.slug }, importBalloonCsv.capability);
  const file = await readUploadedFile(req, { maxBytes: MAX_IMPORT_BYTES, tooLargeHint: CSV_TOO_LARGE_HINT });
  return importBalloonCsv(caller, { lab: params.slug }, { ...query(), file });
});
