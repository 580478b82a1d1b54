import { expect } from "vitest";
import { PATCH as patchChartRoute } from "@/app/api/v1/charts/[id]/route";
import { POST as createEditionRoute } from "@/app/api/v1/charts/[id]/editions/route";
import { POST as approveRoute } from "@/app/api/v1/editions/[id]/approve/route";
import { as, type Person } from "../../support/roles";
import { callJson } from "../../support/routes";

/**
 * The sign-off steps through the routes, each taken by the role that may (educator drafts and
 * edits, lead approves); each expects success. `chart` is read when a step runs.
 */
export function signOffSteps(people: () => { educator: Person; lead: Person }, chart: () => number) {
  const steps = {
    async newEdition(chartId = chart()) {
      as(people().educator);
      const r = await callJson<{ id: string }, { id: number }>(createEditionRoute, { id: String(chartId) }, "POST");
      expect([200, 201], JSON.stringify(r.json)).toContain(r.status);
      return r.json.id;
    },
    async approve(id: number) {
      as(people().lead);
      const r = await callJson(approveRoute, { id: String(id) }, "POST", { reviewed: true });
      expect(r.status, JSON.stringify(r.json)).toBe(200);
    },
    async approvedEdition(chartId = chart()) {
      const id = await steps.newEdition(chartId);
      await steps.approve(id);
      return id;
    },
    async patch(body: unknown) {
      as(people().educator);
      expect((await callJson(patchChartRoute, { id: String(chart()) }, "PATCH", body)).status).toBe(200);
    },
  };
  return steps;
}
