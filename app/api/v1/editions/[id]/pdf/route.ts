import { api } from "@/lib/http/route";
import { posterPdf } from "@/lib/ops/renders";

/** ?tiles=A4|A3|LETTER|TABLOID, ?format=poster|card, ?copy=archive (managers), ?view=inline; anything else is 400. */
export const GET = api<{ id: string }>(async ({ caller, params, query }) => {
  const { pdf, fileName, cached, band } = await posterPdf(caller, { editionId: params.id }, query());
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `${query().view === "inline" ? "inline" : "attachment"}; filename="${fileName}"`,
      "cache-control": "private, no-store",
      "x-render-cache": cached ? "hit" : "miss",
      ...(band ? { "x-poster-band": band } : {}),
    },
  });
});
