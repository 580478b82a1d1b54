// The session double for integration tests: `vi.mock("@/lib/auth/session", () => import("../support/session"))`
// makes `as(...)` decide who the route or action sees as signed in; everything else stays real.
import type { SessionUser } from "@/lib/auth/session";

export const session = { user: null as SessionUser | null };

export const currentUser = async (): Promise<SessionUser | null> => session.user;
