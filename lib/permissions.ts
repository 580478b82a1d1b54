export const ROLES = ["manager", "lead", "educator", "operator"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  manager: "Manager",
  lead: "Medical lead",
  educator: "Educator",
  operator: "Operator",
};

// What each role may do inside one lab (lib/README.md, "What is where"; the lab rules may widen
// edition:approve to managers, lib/ops/access.ts labCan).
export const CAPABILITIES = {
  "lab:read": ["manager", "lead", "educator", "operator"],
  "stock:edit": ["manager"],
  "members:manage": ["manager"],
  "rooms:manage": ["manager"],
  "settings:manage": ["manager"],
  "tokens:manage": ["manager"],
  "audit:read": ["manager"],
  "chart:design": ["manager", "educator"],
  "edition:create": ["manager", "educator"],
  // The medical lead always; a manager only where the lab's rules grant it (lib/ops/access.ts).
  "edition:approve": ["lead"],
  "edition:withdraw": ["manager"],
  "edition:archive-copy": ["manager"],
  "chart:archive": ["manager", "lead"],
  "rules:manage": ["lead"],
  "posting:record": ["manager", "lead", "educator", "operator"],
} as const satisfies Record<string, readonly Role[]>;

export type Capability = keyof typeof CAPABILITIES;

export function can(role: Role, capability: Capability): boolean {
  return (CAPABILITIES[capability] as readonly Role[]).includes(role);
}

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}
