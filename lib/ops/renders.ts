import "server-only";
import { recordAudit } from "@/db/queries/audit";
import { getEdition } from "@/db/queries/editions";
import { findLogoBytes, findRender, storeRender } from "@/db/queries/renders";
import { fingerprintOf } from "@/lib/charts/fingerprint";
import { editionUrls } from "@/lib/charts/present";
import { env } from "@/lib/env";
import { notFound } from "@/lib/errors";
import { renderPosterPdf } from "@/lib/poster/pdf/render";
import { POSTER_RENDERER_VERSION } from "@/lib/poster/version";
import { labOperation } from "./operation";

const slugify = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-|-$/g, "")
    .slice(0, 60) || "chart";

/**
 * The poster PDF of an edition. Renders are cached in the database by everything that decides
 * the bytes (snapshot fingerprint, state, approval, check URL, renderer version), so a second
 * download, on any app instance, does not render again. Every download is audited.
 */
export const posterPdf = labOperation({
  name: "edition.pdf",
  capability: "lab:read",
  scope: "edition",
  run: async ({ labId, actor, ids }) => {
    const ed = await getEdition({ labId, editionId: ids.editionId });
    if (!ed) throw notFound("Edition");
    const edition = {
      number: ed.number,
      status: ed.status,
      approvedAt: ed.approvedAt,
      approvedByName: ed.approvedByName,
      fingerprint: ed.fingerprint,
      checkUrl: editionUrls(env.APP_URL, ed).checkUrl,
    };
    const renderKey = fingerprintOf({
      renderer: POSTER_RENDERER_VERSION,
      ...edition,
      approvedAt: edition.approvedAt?.toISOString() ?? null,
    });
    const hit = await findRender({ renderKey });
    let pdf = hit;
    if (!pdf) {
      const logo = ed.snapshot.logoSha256 ? await findLogoBytes({ labId, sha256: ed.snapshot.logoSha256 }) : null;
      pdf = await renderPosterPdf({ snapshot: ed.snapshot, edition, logo });
      await storeRender({ editionId: ed.id, renderKey, pdf });
    }
    await recordAudit({
      labId,
      actorUserId: actor.id,
      action: "edition.downloaded",
      targetType: "edition",
      targetId: ed.id,
      detail: { number: ed.number, status: ed.status, cached: Boolean(hit) },
    });
    const fileName = `${slugify(ed.chartTitle)}-edition-${ed.number}${ed.status === "draft" || ed.status === "returned" ? "-DRAFT" : ""}.pdf`;
    return { pdf, fileName, cached: Boolean(hit) };
  },
});
