import "server-only";
import { cache } from "react";
import { findChartLab } from "@/db/queries/charts";
import { findEditionLab } from "@/db/queries/editions";
import { findLabWithRole } from "@/db/queries/members";
import { getLabRules } from "@/db/queries/lab-rules";
import type { SessionUser } from "@/lib/auth/session";
import { AppError, forbidden, notFound, unauthenticated } from "@/lib/errors";
import { SLUG_MAX, SLUG_PATTERN } from "@/lib/validation/lab";
import type { TokenScope } from "@/lib/validation/tokens";
import { can, type Capability, type Role } from "@/lib/permissions";
import type { Caller } from "./caller";

export type Member = {
  user: SessionUser;
  lab: {
    id: number;
    slug: string;
    name: string;
    stockRevision: number;
    isDemo: boolean;
    /** IANA zone for every date shown for this lab (lib/format/dates.ts). */
    timeZone: string;
    /** Decimal separator printed on posters (lib/format/numbers.ts). */
    numberFormat: "point" | "comma";
    /** Whom to ask, for the check page. */
    contactLine: string | null;
  };
  role: Role;
};

/** How an operation finds its lab: by slug, or through a chart or edition that belongs to one. */
export type LabRef = { lab: string } | { labId: number } | { chartId: number } | { editionId: number };

// One lookup per request for the header, the page and the operations it calls.
const labBySlug = cache((slug: string, userId: number) => findLabWithRole({ slug, userId }));
const labById = cache((labId: number, userId: number) => findLabWithRole({ labId, userId }));

const labRulesFor = cache((labId: number) => getLabRules({ labId }));

const refLabel = (ref: LabRef) => ("chartId" in ref ? "Chart" : "editionId" in ref ? "Edition" : "Lab");

/**
 * The role table plus what the lab's own rules add to it: approval by managers when the medical
 * lead grants it. Pages use it to decide which buttons to show; operations check it in `authorize`.
 */
export async function labCan(labId: number, role: Role, capability: Capability): Promise<boolean> {
  if (can(role, capability)) return true;
  if (capability !== "edition:approve" || role !== "manager") return false;
  return (await labRulesFor(labId)).managersMayApprove;
}

/** 403 for a machine token outside the stock routes of its lab. */
export const machineRefused = () =>
  new AppError("forbidden", "Machine tokens may use only the stock routes of their own lab.");

export function signedIn(caller: Caller): SessionUser {
  if (caller.kind === "token") throw machineRefused();
  if (caller.kind !== "user") throw unauthenticated();
  return caller.user;
}

/**
 * The lab a machine token may work in, for an operation open to tokens with `scope`: another lab
 * (or a chart or edition of one) answers 404 like a lab that does not exist; an operation not
 * open to tokens, or a scope the token lacks, 403.
 */
export async function authorizeToken(
  caller: Extract<Caller, { kind: "token" }>,
  ref: LabRef,
  scope: TokenScope | undefined,
): Promise<{ labId: number }> {
  const { token } = caller;
  const labId =
    "lab" in ref
      ? ref.lab === token.labSlug
        ? token.labId
        : null
      : "labId" in ref
        ? ref.labId
        : "chartId" in ref
          ? await findChartLab({ chartId: ref.chartId })
          : await findEditionLab({ editionId: ref.editionId });
  if (labId !== token.labId) throw notFound(refLabel(ref));
  if (!scope) throw machineRefused();
  if (!token.scopes.includes(scope)) throw new AppError("forbidden", `This token lacks the ${scope} scope.`);
  return { labId };
}

/**
 * The caller's role in the lab and one capability, in this order: anonymous -> 401, not a member
 * (or no such lab, chart or edition) -> 404, role lacks the capability -> 403.
 */
export async function authorize(caller: Caller, ref: LabRef, capability: Capability): Promise<Member> {
  const user = signedIn(caller);
  // A string no slug can be (a lone surrogate, say) may still compare equal under the collation.
  if ("lab" in ref && !(ref.lab.length <= SLUG_MAX && SLUG_PATTERN.test(ref.lab))) throw notFound("Lab");
  let lab;
  if ("lab" in ref) lab = await labBySlug(ref.lab, user.id);
  else {
    const labId =
      "labId" in ref
        ? ref.labId
        : "chartId" in ref
          ? await findChartLab({ chartId: ref.chartId })
          : await findEditionLab({ editionId: ref.editionId });
    lab = labId === null ? null : await labById(labId, user.id);
  }
  // A lab the person is not in answers exactly like one that does not exist.
  if (!lab || !lab.role) throw notFound(refLabel(ref));
  if (!(await labCan(lab.id, lab.role, capability))) throw forbidden();
  const { role, ...rest } = lab;
  return { user, lab: rest, role };
}
