import { getChartLogo, setChartLogo } from "@/db/queries/charts";
import { chartRoute } from "@/lib/auth/resource-guard";
import { notFound } from "@/lib/errors";
import { checkLogo, LOGO_MAX_BYTES } from "@/lib/logo";
import { readUploadedFile } from "@/lib/upload";

export const GET = chartRoute("lab:read", async (_req, member, chartId) => {
  const logo = await getChartLogo({ labId: member.lab.id, chartId });
  if (!logo) throw notFound("Logo");
  return new Response(new Uint8Array(logo.bytes), {
    headers: { "content-type": logo.mime, "cache-control": "private, max-age=300", etag: `"${logo.sha256}"` },
  });
});

/** PUT multipart `file`: a PNG or JPEG of at most 1 MB, checked from its bytes. */
export const PUT = chartRoute("chart:design", async (req, member, chartId) => {
  const file = await readUploadedFile(req, { maxBytes: LOGO_MAX_BYTES, tooLargeHint: "Use a smaller PNG or JPEG." });
  const checked = await checkLogo(file.bytes);
  const { logoId } = await setChartLogo({
    labId: member.lab.id,
    chartId,
    userId: member.user.id,
    logo: { bytes: Buffer.from(file.bytes), mime: checked.mime, sha256: checked.sha256 },
  });
  return Response.json({
    logoId,
    mime: checked.mime,
    sha256: checked.sha256,
    width: checked.width,
    height: checked.height,
  });
});

export const DELETE = chartRoute("chart:design", async (_req, member, chartId) => {
  await setChartLogo({ labId: member.lab.id, chartId, userId: member.user.id, logo: null });
  return new Response(null, { status: 204 });
});
