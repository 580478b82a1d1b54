import { api } from "@/lib/http/route";
import { editionDiff } from "@/lib/ops/editions";

// The printed cells that differ from the edition this one would replace.
export const GET = api<{ id: string }>(({ caller, params }) => editionDiff(caller, { editionId: params.id }));
