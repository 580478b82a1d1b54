import { api } from "@/lib/http/route";
import { chartGrid } from "@/lib/ops/charts";

// What an edition made now would print: the chart's live snapshot, cell by cell.
export const GET = api<{ id: string }>(({ caller, params }) => chartGrid(caller, { chartId: params.id }));
