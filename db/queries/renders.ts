import "server-only";
import { and, eq } from "drizzle-orm";
import { renderPosterPdf } from "@/components/poster/render";
import { fingerprintOf } from "@/lib/charts/fingerprint";
import { editionUrls } from "@/lib/charts/present";
import { notFound } from "@/lib/errors";
import { POSTER_RENDERER_VERSION } from "@/lib/poster/version";
import { db } from "../index";
import { logos, posterRenders } from "../schema";
import { recordAudit } from "./audit";
import { getEdition } from "./editions";

/**
 * The poster PDF of an edition. Renders are cached in the database by everything that decides
 * the bytes (snapshot fingerprint, state, approval, check URL, renderer version), so a second
 * download, on any app instance, does not render again.
 */
export async function getPosterPdf({
  labId,
  editionId,
  appUrl,
  actorUserId,
}: {
  labId: number;
  editionId: number;
  appUrl: string;
  actorUserId: number;
}) {
  const ed = await getEdition({ labId, editionId });
  if (!ed) throw notFound("Edition");
  const edition = {
    number: ed.number,
    status: ed.status,
    approvedAt: ed.approvedAt,
    approvedByName: ed.approvedByName,
    fingerprint: ed.fingerprint,
    checkUrl: editionUrls(appUrl, ed).checkUrl,
  };
  const renderKey = fingerprintOf({
    renderer: POSTER_RENDERER_VERSION,
    ...edition,
    approvedAt: edition.approvedAt?.toISOString() ?? null,
  });
  const [hit] = await db
    .select({ pdf: posterRenders.pdf })
    .from(posterRenders)
    .where(eq(posterRenders.renderKey, renderKey));
  let pdf = hit?.pdf;
  if (!pdf) {
    const logoRow = ed.snapshot.logoSha256
      ? (
          await db
            .select({ bytes: logos.bytes, mime: logos.mime })
            .from(logos)
            .where(and(eq(logos.labId, labId), eq(logos.sha256, ed.snapshot.logoSha256)))
        )[0]
      : undefined;
    const logo = logoRow ? { bytes: logoRow.bytes, mime: logoRow.mime as "image/png" | "image/jpeg" } : null;
    pdf = await renderPosterPdf({ snapshot: ed.snapshot, edition, logo });
    // Two instances may render at once; the first row wins and both bytes are identical.
    await db
      .insert(posterRenders)
      .values({ editionId: ed.id, renderKey, pdf })
      .onDuplicateKeyUpdate({ set: { renderKey } });
  }
  await recordAudit({
    labId,
    actorUserId,
    action: "edition.printed",
    targetType: "edition",
    targetId: ed.id,
    detail: { number: ed.number, status: ed.status, cached: Boolean(hit) },
  });
  return {
    pdf,
    fileName: `${slugify(ed.chartTitle)}-edition-${ed.number}${ed.status === "draft" ? "-DRAFT" : ""}.pdf`,
    cached: Boolean(hit),
  };
}

const slugify = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-|-$/g, "")
    .slice(0, 60) || "chart";
