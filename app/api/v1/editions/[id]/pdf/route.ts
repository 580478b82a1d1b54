import { getPosterPdf } from "@/db/queries/renders";
import { editionRoute } from "@/lib/auth/resource-guard";
import { env } from "@/lib/env";

export const GET = editionRoute("lab:read", async (_req, member, editionId) => {
  const { pdf, fileName, cached } = await getPosterPdf({
    labId: member.lab.id,
    editionId,
    appUrl: env.APP_URL,
    actorUserId: member.user.id,
  });
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `attachment; filename="${fileName}"`,
      "cache-control": "private, no-store",
      "x-render-cache": cached ? "hit" : "miss",
    },
  });
});
