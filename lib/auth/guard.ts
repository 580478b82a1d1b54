import "server-only";
import type { z } from "zod";
import { findLabWithRole } from "@/db/queries/members";
import { AppError, errorResponse, forbidden, invalidInput, notFound, unauthenticated } from "@/lib/errors";
import { can, type Capability, type Role } from "@/lib/permissions";
import { currentUser, type SessionUser } from "./session";

export type Member = {
  user: SessionUser;
  lab: { id: number; slug: string; name: string; stockRevision: number; isDemo: boolean };
  role: Role;
};

/** Which lab: by slug, by id, or through a resource that belongs to one (null when it does not exist). */
type LabRef = { slug: string } | { labId: number } | { via: () => Promise<number | null>; what: string };

/**
 * Resolves the signed-in member's role in a lab and checks a capability, in this order:
 * anonymous -> 401, not a member (or no such lab) -> 404, role lacks the capability -> 403.
 */
export async function requireMember(ref: LabRef, capability: Capability): Promise<Member> {
  const user = await currentUser();
  if (!user) throw unauthenticated();
  let lab;
  if ("slug" in ref) lab = await findLabWithRole({ slug: ref.slug, userId: user.id });
  else {
    const labId = "labId" in ref ? ref.labId : await ref.via();
    if (labId === null) throw notFound("via" in ref ? ref.what : "Lab");
    lab = await findLabWithRole({ labId, userId: user.id });
  }
  // A lab the person is not in answers exactly like one that does not exist.
  if (!lab || !lab.role) throw notFound("via" in ref ? ref.what : "Lab");
  if (!can(lab.role, capability)) throw forbidden();
  const { role, ...rest } = lab;
  return { user, lab: rest, role };
}

export async function requireUser(): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) throw unauthenticated();
  return user;
}

export function parseWith<S extends z.ZodType>(schema: S, input: unknown): z.infer<S> {
  const parsed = schema.safeParse(input);
  if (!parsed.success) throw invalidInput(parsed.error.issues);
  return parsed.data;
}

/** The request's JSON body; with `optional`, an empty body reads as {}. */
export async function readJson(req: Request, opts: { optional?: boolean } = {}): Promise<unknown> {
  const text = await req.text();
  if (opts.optional && text.trim() === "") return {};
  const type = req.headers.get("content-type") ?? "";
  if (!type.includes("application/json"))
    throw new AppError("invalid_input", "Send a JSON body (Content-Type: application/json).");
  if (text.length > 256 * 1024) throw new AppError("payload_too_large", "The JSON body is larger than 256 KB.");
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("invalid_input", "The body is not valid JSON.");
  }
}

type RouteCtx<P> = { params: Promise<P> };

/** Wraps a route handler so that any thrown AppError becomes its JSON response. */
export function route<P = Record<string, string>>(fn: (req: Request, params: P) => Promise<Response>) {
  return async (req: Request, ctx: RouteCtx<P>): Promise<Response> => {
    try {
      return await fn(req, await ctx.params);
    } catch (err) {
      return errorResponse(err);
    }
  };
}

/** A lab-scoped route: /api/v1/labs/:slug/... guarded by one capability. */
export function labRoute<P extends { slug: string }>(
  capability: Capability,
  fn: (req: Request, member: Member, params: P) => Promise<Response>,
) {
  return route<P>(async (req, params) => fn(req, await requireMember({ slug: params.slug }, capability), params));
}
