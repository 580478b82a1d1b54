import { api } from "@/lib/http/route";
import { getStock } from "@/lib/ops/stock";

export const GET = api<{ slug: string }>(({ caller, params }) => getStock(caller, { lab: params.slug }));
