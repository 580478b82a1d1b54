import { api } from "@/lib/http/route";
import { getChartLogo, removeChartLogo, setChartLogo } from "@/lib/ops/charts";
import { LOGO_MAX_BYTES, LOGO_TOO_LARGE_HINT } from "@/lib/logo";
import { readUploadedFile } from "@/lib/upload";

type Params = { id: string };

export const GET = api<Params>(async ({ caller, params }) => {
  const logo = await getChartLogo(caller, { chartId: params.id });
  return new Response(new Uint8Array(logo.bytes), {
    headers: { "content-type": logo.mime, "cache-control": "private, max-age=300", etag: `"${logo.sha256}"` },
  });
});

/** PUT multipart `file`: a PNG or JPEG of at most 1 MB, checked from its bytes. */
export const PUT = api<Params>(async ({ req, caller, params }) => {
  const file = await readUploadedFile(req, { maxBytes: LOGO_MAX_BYTES, tooLargeHint: LOGO_TOO_LARGE_HINT });
  return setChartLogo(caller, { chartId: params.id }, { file });
});

export const DELETE = api<Params>(async ({ caller, params }) => {
  await removeChartLogo(caller, { chartId: params.id });
  return new Response(null, { status: 204 });
});
