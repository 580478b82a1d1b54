import { api } from "@/lib/http/route";
import { posterPdf } from "@/lib/ops/renders";

export const GET = api<{ id: string }>(async ({ caller, params }) => {
  const { pdf, fileName, cached } = await posterPdf(caller, { editionId: params.id });
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `attachment; filename="${fileName}"`,
      "cache-control": "private, no-store",
      "x-render-cache": cached ? "hit" : "miss",
    },
  });
});
