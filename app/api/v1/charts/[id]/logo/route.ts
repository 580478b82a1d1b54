import { notFound } from "@/lib/errors";
import { api } from "@/lib/http/route";
import { authorize } from "@/lib/ops/access";
import { getChartLogo, removeChartLogo, setChartLogo } from "@/lib/ops/charts";
import { LOGO_MAX_BYTES, LOGO_TOO_LARGE_HINT } from "@/lib/logo";
import { readUploadedFile } from "@/lib/upload";
import { idSchema } from "@/lib/validation/id";

type Params = { id: string };

export const GET = api<Params>(async ({ caller, params }) => {
  const logo = await getChartLogo(caller, { chartId: params.id });
  return new Response(new Uint8Array(logo.bytes), {
    headers: { "content-type": logo.mime, "cache-control": "private, max-age=300", etag: `"${logo.sha256}"` },
  });
});

/** PUT multipart `file`: a PNG or JPEG of at most 1 MB, checked from its bytes. */
export const PUT = api<Params>(async ({ req, caller, params }) => {
  // The role is checked before the body is read: a refused caller gets 401/403/404, never 400 or 413.
  const chartId = idSchema.safeParse(params.id);
  if (!chartId.success) throw notFound("Chart");
  await authorize(caller, { chartId: chartId.data }, setChartLogo.capability);
  const file = await readUploadedFile(req, { maxBytes: LOGO_MAX_BYTES, tooLargeHint: LOGO_TOO_LARGE_HINT });
  return setChartLogo(caller, { chartId: params.id }, { file });
});

export const DELETE = api<Params>(async ({ caller, params }) => {
  await removeChartLogo(caller, { chartId: params.id });
  return new Response(null, { status: 204 });
});
