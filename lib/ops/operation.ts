import "server-only";
import type { z } from "zod";
import { invalidInput, notFound } from "@/lib/errors";
import { annotateLog, requestLog } from "@/lib/request-log";
import type { Capability } from "@/lib/permissions";
import { BAD_ID, idSchema } from "@/lib/validation/id";
import { illFormedText } from "@/lib/validation/well-formed";
import type { TokenScope } from "@/lib/validation/tokens";
import { authorize, authorizeToken, type LabRef, type Member } from "./access";
import type { Actor, Caller } from "./caller";

type Scope = "lab" | "chart" | "edition";
type ScopeRef<S extends Scope> = S extends "lab"
  ? { lab: string }
  : S extends "chart"
    ? { chartId: unknown }
    : { editionId: unknown };
type ScopeId<S extends Scope> = S extends "chart" ? "chartId" : S extends "edition" ? "editionId" : never;

/** Who a write is audited under: the person, or the machine token ("token <name>"). */
export type AuditBy = { actorUserId: number | null; actorTokenId: number | null };

type Common<K extends string> = { labId: number; ids: Record<K, number>; by: AuditBy };

/**
 * What an operation runs with. Operations open to machine tokens (`machine` set) may be called
 * without a person: their `member` and `actor` are null for a token, and they audit through `by`.
 */
export type OpContext<K extends string, M extends boolean = false> = Common<K> &
  (M extends true ? { member: Member | null; actor: Actor | null } : { member: Member; actor: Actor });

/** "roomId" -> "Room": the thing a bad id in the input fails to name. */
const nounOf = (key: PropertyKey | undefined) =>
  typeof key === "string" && key.endsWith("Id") && key.length > 2
    ? key[0]!.toUpperCase() + key.slice(1, -2)
    : undefined;

/** Parses input with its zod schema: an id that cannot name a row is 404, anything else wrong is 400. */
export function parseInput<S extends z.ZodType>(schema: S, raw: unknown, what = "That"): z.infer<S> {
  const broken = illFormedText(raw);
  if (broken) throw invalidInput([{ path: broken, message: "Contains a broken character (a lone UTF-16 surrogate)." }]);
  const parsed = schema.safeParse(raw);
  if (parsed.success) return parsed.data;
  const badId = parsed.error.issues.find((i) => i.message === BAD_ID);
  if (badId) throw notFound(nounOf(badId.path.at(-1)) ?? what);
  throw invalidInput(parsed.error.issues);
}

function parseId(raw: unknown, what: string): number {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw notFound(what);
  return parsed.data;
}

/** Times an operation and logs its outcome once; the caller's error handling logs failures. */
export async function traced<R>(name: string, fields: Record<string, unknown>, fn: () => Promise<R>): Promise<R> {
  const started = performance.now();
  annotateLog({ ...fields, operation: name });
  const result = await fn();
  requestLog({ durationMs: Math.round(performance.now() - started) }).debug({ op: name }, "operation done");
  return result;
}

/**
 * An operation inside one lab: finds the lab from the reference, checks the caller's capability
 * there (401, 404, 403), then reads further ids (404 for a bad or foreign one, like a missing row)
 * and validates the input with its zod schema (400), then runs. Every route handler, server action and page that changes or reads lab data
 * goes through one of these.
 */
export function labOperation<
  S extends Scope,
  I extends z.ZodType,
  R,
  K extends string = never,
  T extends TokenScope | undefined = undefined,
>(spec: {
  name: string;
  capability: Capability;
  scope: S;
  /** Further ids in the reference, each with the noun a "not found" answer names. */
  ids?: Record<K, string>;
  input?: I;
  /** The scope a machine token needs to call this operation; without it, tokens are refused (403). */
  machine?: T;
  run: (ctx: OpContext<K | ScopeId<S>, T extends TokenScope ? true : false>, input: z.infer<I>) => Promise<R>;
}) {
  const op = async (caller: Caller, ref: ScopeRef<S> & Record<K, unknown>, input?: unknown): Promise<R> => {
    const r = ref as Record<string, unknown>;
    const labRef: LabRef =
      spec.scope === "lab"
        ? { lab: String(r.lab) }
        : spec.scope === "chart"
          ? { chartId: parseId(r.chartId, "Chart") }
          : { editionId: parseId(r.editionId, "Edition") };
    const token = caller.kind === "token" ? caller.token : null;
    const member = token ? null : await authorize(caller, labRef, spec.capability);
    const labId = token ? (await authorizeToken({ kind: "token", token }, labRef, spec.machine)).labId : member!.lab.id;
    const ids = Object.fromEntries(
      Object.entries<string>(spec.ids ?? ({} as Record<K, string>)).map(([key, what]) => [key, parseId(r[key], what)]),
    ) as Record<K, number>;
    const data = spec.input ? parseInput(spec.input, input ?? {}) : (undefined as z.infer<I>);
    const ctx = {
      member,
      actor: member ? { id: member.user.id, name: member.user.name } : null,
      labId,
      ids: { ...ids, ...labRef } as Record<K | ScopeId<S>, number>,
      by: { actorUserId: member?.user.id ?? null, actorTokenId: token?.id ?? null },
    } as OpContext<K | ScopeId<S>, T extends TokenScope ? true : false>;
    const who = token ? { tokenId: token.id } : { userId: member!.user.id };
    return traced(spec.name, { ...who, labId }, () => spec.run(ctx, data));
  };
  return Object.assign(op, {
    operation: spec.name,
    capability: spec.capability,
    scope: spec.scope,
    machine: spec.machine ?? null,
  });
}
