import { api } from "@/lib/http/route";
import { editionGrid } from "@/lib/ops/editions";

// The frozen edition's grid, cell by cell, as its poster prints it.
export const GET = api<{ id: string }>(({ caller, params }) => editionGrid(caller, { editionId: params.id }));
