import "server-only";
import { z } from "zod";
import { recordAudit } from "@/db/queries/audit";
import { getCheckByToken } from "@/lib/ops/check";
import { getEdition } from "@/db/queries/editions";
import { findLabPrintSettings, findLogoBytes, findRender, storeRender } from "@/db/queries/renders";
import { fingerprintOf } from "@/lib/charts/fingerprint";
import { editionUrls } from "@/lib/charts/present";
import { formatShortCode } from "@/lib/editions/short-code";
import { env } from "@/lib/env";
import { AppError, notFound } from "@/lib/errors";
import { formatDate } from "@/lib/format/dates";
import { can } from "@/lib/permissions";
import { bandFor, printEdition } from "@/lib/poster/pdf/print";
import type { Band } from "@/lib/poster/pdf/variants";
import { shortCodeUrl } from "@/lib/poster/labels";
import { TILE_SHEETS } from "@/lib/poster/tiles";
import { POSTER_RENDERER_VERSION } from "@/lib/poster/version";
import { labOperation } from "./operation";

const slugify = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-|-$/g, "")
    .slice(0, 60) || "chart";

/**
 * The query of GET /api/v1/editions/:id/pdf: `tiles` (office sheets), `format` (poster or badge
 * card) and `copy=archive` (managers: the edition as approved, stamped as an archive copy).
 */
export const pdfVariantSchema = z
  .object({
    tiles: z.enum(TILE_SHEETS, { error: `tiles must be one of ${TILE_SHEETS.join(", ")}` }).optional(),
    format: z.enum(["poster", "card"], { error: "format must be poster or card" }).optional(),
    copy: z.enum(["archive"], { error: "copy must be archive" }).optional(),
    // Shown in the browser's own viewer instead of saved; the bytes are the same.
    view: z.enum(["inline"], { error: "view must be inline" }).optional(),
  })
  .strict()
  .refine((q) => !(q.tiles && q.format === "card"), {
    path: ["tiles"],
    message: "tiles cannot be combined with format=card",
  });
export type PdfVariant = z.infer<typeof pdfVariantSchema>;

/**
 * The poster PDF of an edition, or one of its variants (tiled on office sheets, badge card).
 * An edition that is not current (draft, returned, superseded, withdrawn, or approved but
 * outdated) gets its state's stamp on every page (lib/poster/pdf/print.ts); a manager may ask for the archive copy instead, which keeps
 * the poster as approved and is stamped ARCHIVE COPY. Renders are cached in the database by
 * everything that decides the bytes (snapshot fingerprint, state, approval, check URL, lab print
 * settings, variant, band and its date, renderer version), so a second download, on any app
 * instance, does not render again. Every download is audited.
 */
export const posterPdf = labOperation({
  name: "edition.pdf",
  capability: "lab:read",
  scope: "edition",
  input: pdfVariantSchema,
  run: async ({ labId, actor, ids, member }, variant) => {
    const archive = variant.copy === "archive";
    if (archive && !can(member.role, "edition:archive-copy"))
      throw new AppError("forbidden", "Only a manager may download the archive copy of an edition.");
    const ed = await getEdition({ labId, editionId: ids.editionId });
    if (!ed) throw notFound("Edition");
    const lab = await findLabPrintSettings({ labId });
    const shortCode = formatShortCode(ed.shortCode);
    const edition = {
      number: ed.number,
      status: ed.status,
      approvedAt: ed.approvedAt,
      approvedByName: ed.approvedByName,
      reviewBy: ed.reviewBy ?? null,
      fingerprint: ed.fingerprint,
      shortCode,
      checkUrl: editionUrls(env.APP_URL, ed).checkUrl,
      codeUrl: shortCodeUrl(env.APP_URL, ed.shortCode),
    };
    const today = formatDate(new Date(), lab.timeZone);
    let band: Band | null = null;
    let checkStatus: string = ed.status;
    if (archive) band = { kind: "archive", date: today };
    else if (ed.status === "draft" || ed.status === "returned") band = bandFor(ed.status, today);
    else {
      const check = await getCheckByToken({ token: ed.checkToken });
      checkStatus = check?.status ?? ed.status;
      band = bandFor(check?.status ?? ed.status, today);
    }
    const format = variant.format ?? "poster";
    const renderKey = fingerprintOf({
      renderer: POSTER_RENDERER_VERSION,
      ...edition,
      approvedAt: edition.approvedAt?.toISOString() ?? null,
      reviewBy: edition.reviewBy?.toISOString() ?? null,
      lab,
      format,
      tiles: variant.tiles ?? null,
      band,
    });
    const hit = await findRender({ renderKey });
    let pdf: Buffer;
    if (hit) pdf = hit;
    else {
      const logo = ed.snapshot.logoSha256 ? await findLogoBytes({ labId, sha256: ed.snapshot.logoSha256 }) : null;
      // The archive copy is the poster as approved: its own state's banner is not re-printed.
      const printed = archive && ed.approvedAt ? { ...edition, status: "approved" as const } : edition;
      const input = { snapshot: ed.snapshot, edition: printed, logo, lab };
      pdf = await printEdition(input, {
        format,
        tiles: variant.tiles ?? null,
        band,
        sheetLabels: {
          title: ed.snapshot.title,
          edition: ed.number,
          shortCode,
          shortUrl: edition.codeUrl.replace(/^https?:\/\//, ""),
          checkUrl: edition.checkUrl,
        },
      });
      await storeRender({ editionId: ed.id, renderKey, pdf });
    }
    await recordAudit({
      labId,
      actorUserId: actor.id,
      action: archive ? "edition.archive_copy" : "edition.downloaded",
      targetType: "edition",
      targetId: ed.id,
      detail: {
        number: ed.number,
        status: checkStatus,
        format,
        ...(variant.tiles ? { tiles: variant.tiles } : {}),
        ...(band ? { band: band.kind } : {}),
        cached: Boolean(hit),
      },
    });
    const suffix =
      (ed.status === "draft" || ed.status === "returned" ? "-DRAFT" : "") +
      (archive ? "-ARCHIVE-COPY" : band?.kind === "not-current" ? "-NOT-CURRENT" : "") +
      (format === "card" ? "-card" : "") +
      (variant.tiles ? `-tiles-${variant.tiles}` : "");
    const fileName = `${slugify(ed.chartTitle)}-edition-${ed.number}${suffix}.pdf`;
    return { pdf, fileName, cached: Boolean(hit), band: band?.kind ?? null };
  },
});
