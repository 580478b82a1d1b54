import "server-only";
import { findChartLab } from "@/db/queries/charts";
import { findEditionLab } from "@/db/queries/editions";
import { notFound } from "@/lib/errors";
import type { Capability } from "@/lib/permissions";
import { idParam } from "@/lib/validation/edition";
import { requireMember, route, type Member } from "./guard";

function parseId(raw: string, what: string): number {
  const parsed = idParam.safeParse(raw);
  if (!parsed.success) throw notFound(what);
  return parsed.data;
}

/** /api/v1/charts/:id/... — the chart's lab decides membership and role. */
export function chartRoute(
  capability: Capability,
  fn: (req: Request, member: Member, chartId: number) => Promise<Response>,
) {
  return route<{ id: string }>(async (req, params) => {
    const chartId = parseId(params.id, "Chart");
    const member = await requireMember({ via: () => findChartLab({ chartId }), what: "Chart" }, capability);
    return fn(req, member, chartId);
  });
}

/** /api/v1/editions/:id/... — the edition's lab decides membership and role. */
export function editionRoute(
  capability: Capability,
  fn: (req: Request, member: Member, editionId: number) => Promise<Response>,
) {
  return route<{ id: string }>(async (req, params) => {
    const editionId = parseId(params.id, "Edition");
    const member = await requireMember({ via: () => findEditionLab({ editionId }), what: "Edition" }, capability);
    return fn(req, member, editionId);
  });
}
