import { getEdition } from "@/db/queries/editions";
import { editionRoute } from "@/lib/auth/resource-guard";
import { gridJson } from "@/lib/charts/grid-model";
import { notFound } from "@/lib/errors";

// The frozen edition's grid, cell by cell, as its poster prints it.
export const GET = editionRoute("lab:read", async (_req, member, editionId) => {
  const edition = await getEdition({ labId: member.lab.id, editionId });
  if (!edition) throw notFound("Edition");
  return Response.json(gridJson(edition.snapshot));
});
