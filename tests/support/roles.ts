import type { Caller } from "@/lib/ops/caller";
import type { Role } from "@/lib/permissions";
import { session } from "./session";

export type { Role };
/** Everyone a test acts as: a role in the lab under test, a manager of another lab, or nobody. */
export type Who = Role | "outsider" | "anonymous";
export type Person = { id: number; email: string; name: string };

export const ALL_ROLES: readonly Role[] = ["manager", "lead", "educator", "operator"];

/**
 * Acts as `person` (null: nobody signed in). The session double answers routes and actions with
 * them, and the returned Caller is for operations called directly.
 */
export function as(person: Person | null): Caller {
  if (!person) {
    session.user = null;
    return { kind: "anonymous" };
  }
  const user = { id: person.id, email: person.email, name: person.name };
  session.user = user;
  return { kind: "user", user };
}

/** Someone with a membership in one of the fixture labs (everyone but "anonymous"). */
export type Member = Exclude<Who, "anonymous">;
