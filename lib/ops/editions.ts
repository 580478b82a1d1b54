import "server-only";
import { z } from "zod";
import * as q from "@/db/queries/editions";
import { readFourEyesFacts } from "@/db/queries/four-eyes";
import { gridJson } from "@/lib/charts/grid-model";
import { getLabRules } from "@/db/queries/lab-rules";
import { listRulesChanges } from "@/db/queries/rules-history";
import { editionBreaches } from "@/lib/editions/breaches";
import { diffCells, type EditionDiff } from "@/lib/editions/diff";
import { compareItems, editionPrints, exceptionRecorders, printItems } from "@/lib/editions/prints";
import { POSTER_RENDERER_VERSION } from "@/lib/poster/version";
import { fourEyesRefusal } from "@/lib/editions/four-eyes";
import { editionUrls } from "@/lib/charts/present";
import { AppError, notFound } from "@/lib/errors";
import { legibilityRefusal, LEGIBILITY_RULE } from "@/lib/poster/model";
import { env } from "@/lib/env";
import { approveEditionSchema, rejectEditionSchema, withdrawEditionSchema } from "@/lib/validation/edition";
import { labOperation } from "./operation";
import { mailSignoff } from "./signoff-mail";
import { labWrite } from "./write";

// No options yet: the body is empty or {}, and anything else is refused rather than ignored.
const noOptions = z.object({}).strict();

/** Freezes what the chart prints today into a new numbered draft, or answers the identical draft that waits. */
export const createEdition = labOperation({
  name: "edition.create",
  capability: "edition:create",
  scope: "chart",
  input: noOptions,
  run: async ({ labId, actor, ids }) => {
    const ed = await labWrite(labId, (tx) => q.createEdition(tx, { labId, chartId: ids.chartId, actor }));
    if (!ed.reused) await mailSignoff({ kind: "submitted", labId, editionId: ed.id, byUserId: actor.id });
    return {
      id: ed.id,
      number: ed.number,
      status: "draft" as const,
      fingerprint: ed.fingerprint,
      reused: ed.reused,
      ...editionUrls(env.APP_URL, ed),
    };
  },
});

/**
 * Approves a draft after the approver states they reviewed it; never by anyone who changed what
 * it prints since the chart's last approval, through the chart, the stock or the rules' exceptions
 * (four eyes, lib/editions/four-eyes.ts), and only while it still matches the lab.
 */
export const approveEdition = labOperation({
  name: "edition.approve",
  capability: "edition:approve",
  scope: "edition",
  input: approveEditionSchema,
  run: async ({ labId, actor, ids }) => {
    // Legibility gate: the snapshot is frozen, so this reads it before the write transaction.
    const frozen = await q.getEdition({ labId, editionId: ids.editionId });
    const illegible = frozen && frozen.status === "draft" ? legibilityRefusal(frozen.snapshot) : null;
    if (illegible) throw new AppError("conflict", illegible, [{ path: ["rule"], message: LEGIBILITY_RULE }]);
    const ed = await labWrite(labId, async (tx) => {
      const facts = await readFourEyesFacts(tx, { labId, editionId: ids.editionId, userId: actor.id });
      // Only a draft can be approved: anything else is left to the state check (409).
      const refusal =
        facts?.status === "draft" ? fourEyesRefusal({ ...facts, approverId: actor.id, draft: facts }) : null;
      if (refusal) throw new AppError("forbidden", refusal);
      return q.approveEdition(tx, { labId, editionId: ids.editionId, actor });
    });
    await mailSignoff({ kind: "approved", labId, editionId: ed.id, byName: actor.name, reviewBy: ed.reviewBy });
    return {
      id: ed.id,
      number: ed.number,
      status: "approved" as const,
      superseded: ed.superseded.map((p) => p.number),
      reviewBy: ed.reviewBy.toISOString(),
    };
  },
});

/** Sends a draft back to its author with a reason: it becomes `returned` and can never be approved. */
export const rejectEdition = labOperation({
  name: "edition.reject",
  capability: "edition:approve",
  scope: "edition",
  input: rejectEditionSchema,
  run: async ({ labId, actor, ids }, { reason }) => {
    const ed = await labWrite(labId, (tx) => q.rejectEdition(tx, { labId, editionId: ids.editionId, actor, reason }));
    await mailSignoff({ kind: "returned", labId, editionId: ed.id, byName: actor.name, reason });
    return { id: ed.id, number: ed.number, status: "returned" as const, rejectionReason: reason };
  },
});

export const withdrawEdition = labOperation({
  name: "edition.withdraw",
  capability: "edition:withdraw",
  scope: "edition",
  input: withdrawEditionSchema,
  run: async ({ labId, actor, ids }, { reason }) => {
    const ed = await labWrite(labId, (tx) => q.withdrawEdition(tx, { labId, editionId: ids.editionId, actor, reason }));
    return { id: ed.id, number: ed.number, status: "withdrawn" as const, was: ed.was };
  },
});

/** The frozen edition's grid, cell by cell, as its poster prints it. */
export const editionGrid = labOperation({
  name: "edition.grid",
  capability: "lab:read",
  scope: "edition",
  run: async ({ labId, ids }) => {
    const edition = await q.getEdition({ labId, editionId: ids.editionId });
    if (!edition) throw notFound("Edition");
    return gridJson(edition.snapshot);
  },
});

/** The printed cells that differ from the edition this one replaced, or would replace (every cell when none). */
export const editionDiff = labOperation({
  name: "edition.diff",
  capability: "lab:read",
  scope: "edition",
  run: async ({ labId, ids }): Promise<EditionDiff> => {
    const edition = await q.getEdition({ labId, editionId: ids.editionId });
    if (!edition) throw notFound("Edition");
    const against = await q.getAgainstEdition({ labId, edition });
    return { against: against?.id ?? null, cells: diffCells(against?.snapshot ?? null, edition.snapshot) };
  },
});

/**
 * What an approver reviews: the edition, the edition it replaces (or replaced), the changed cells,
 * everything else it prints, and, for a draft, the lab-rule breaches approval would refuse.
 */
export const editionReview = labOperation({
  name: "edition.review",
  capability: "lab:read",
  scope: "edition",
  run: async ({ labId, ids }) => {
    const edition = await q.getEdition({ labId, editionId: ids.editionId });
    if (!edition) throw notFound("Edition");
    const [against, rules, changes] = await Promise.all([
      q.getAgainstEdition({ labId, edition }),
      getLabRules({ labId }),
      listRulesChanges({ labId }),
    ]);
    const before = against?.snapshot ?? null;
    return {
      edition,
      against,
      cells: diffCells(before, edition.snapshot),
      prints: editionPrints(edition.snapshot, before, exceptionRecorders(changes, edition.chartId)),
      breaches: edition.status === "draft" ? editionBreaches(edition.chartId, edition.snapshot, rules) : [],
      rendererVersion: POSTER_RENDERER_VERSION,
    };
  },
});

/**
 * A chart's editions, newest first, each with who drafted and approved it, when, and what it
 * changed against the edition it replaced (or, never approved, would replace): cells and printed items.
 */
export const chartEditionHistory = labOperation({
  name: "chart.edition_history",
  capability: "lab:read",
  scope: "chart",
  run: async ({ labId, ids }) => {
    const rows = await q.listEditionHistory({ labId, chartId: ids.chartId });
    const byId = new Map(rows.map((r) => [r.id, r]));
    const current = rows.find((r) => r.status === "approved") ?? null;
    // Each snapshot's printed items once: an edition is compared as itself and as a predecessor.
    const items = new Map(rows.map((r) => [r.id, printItems(r.snapshot)]));
    return rows.map((r) => {
      const against = r.replacesId !== null ? (byId.get(r.replacesId) ?? null) : r.approvedAt ? null : current;
      const before = against?.snapshot ?? null;
      return {
        id: r.id,
        number: r.number,
        status: r.status,
        createdAt: r.createdAt,
        createdByName: r.createdByName,
        approvedAt: r.approvedAt,
        approvedByName: r.approvedByName,
        againstNumber: against?.number ?? null,
        changedCells: diffCells(before, r.snapshot).length,
        changedItems: compareItems(items.get(r.id)!, against ? items.get(against.id)! : null)
          .filter((i) => i.changed)
          .map((i) => i.label),
      };
    });
  },
});

/** The approvers' queue: drafts waiting for sign-off, oldest first. */
export const signOffQueue = labOperation({
  name: "edition.queue",
  capability: "edition:approve",
  scope: "lab",
  run: async ({ labId }) => q.listWaitingDrafts({ labId }),
});
