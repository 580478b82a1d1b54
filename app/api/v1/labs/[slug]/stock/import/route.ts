import { api } from "@/lib/http/route";
import { importBalloonCsv } from "@/lib/ops/stock";
import { CSV_TOO_LARGE_HINT } from "@/lib/stock/file";
import { MAX_IMPORT_BYTES } from "@/lib/stock/limits";
import { readUploadedFile } from "@/lib/upload";

/** POST multipart `file` (balloon CSV); ?dryRun=1 previews, otherwise applies; ?revision=n refuses if stock changed since the preview. */
export const POST = api<{ slug: string }>(({ req, caller, params, query }) =>
  importBalloonCsv(
    caller,
    { lab: params.slug },
    {
      ...query(),
      file: () => readUploadedFile(req, { maxBytes: MAX_IMPORT_BYTES, tooLargeHint: CSV_TOO_LARGE_HINT }),
    },
  ),
);
