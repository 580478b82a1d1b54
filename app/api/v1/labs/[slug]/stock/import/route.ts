import { importBalloons } from "@/db/queries/stock";
import { labRoute, parseWith } from "@/lib/auth/guard";
import { csvIssuesError, parseBalloonCsv } from "@/lib/stock/csv";
import { CSV_TOO_LARGE_HINT, decodeImportFile } from "@/lib/stock/file";
import { MAX_IMPORT_BYTES } from "@/lib/stock/limits";
import { readUploadedFile } from "@/lib/upload";
import { importQuery } from "@/lib/validation/stock";

/** POST multipart `file` (balloon CSV); ?dryRun=1 previews, otherwise applies; ?revision=n refuses if stock changed since the preview. */
export const POST = labRoute("stock:edit", async (req, member) => {
  const query = parseWith(importQuery, Object.fromEntries(new URL(req.url).searchParams));
  const file = await readUploadedFile(req, { maxBytes: MAX_IMPORT_BYTES, tooLargeHint: CSV_TOO_LARGE_HINT });
  const parsed = parseBalloonCsv(await decodeImportFile(file.bytes));
  if (parsed.issues.length) throw csvIssuesError(parsed.issues);
  const result = await importBalloons({
    labId: member.lab.id,
    actorUserId: member.user.id,
    rows: parsed.rows,
    dryRun: query.dryRun,
    expectRevision: query.revision,
    fileName: file.name,
  });
  return Response.json(result);
});
