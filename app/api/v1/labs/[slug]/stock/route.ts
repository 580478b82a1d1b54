import { getStock } from "@/db/queries/stock";
import { labRoute } from "@/lib/auth/guard";

export const GET = labRoute("lab:read", async (_req, member) =>
  Response.json(await getStock({ labId: member.lab.id })),
);
