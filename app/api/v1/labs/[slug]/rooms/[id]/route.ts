import { api } from "@/lib/http/route";
import { archiveRoom, renameRoom } from "@/lib/ops/postings";

type Params = { slug: string; id: string };

export const PATCH = api<Params>(async ({ caller, params, body }) =>
  renameRoom(caller, { lab: params.slug, roomId: params.id }, await body()),
);

export const DELETE = api<Params>(async ({ caller, params }) => {
  await archiveRoom(caller, { lab: params.slug, roomId: params.id });
  return new Response(null, { status: 204 });
});
