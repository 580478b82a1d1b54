// Finding 14: a lab slug matches exactly (the database's collation would fold "DEMO" and pad "demo\0").
import { afterAll, describe, expect, it } from "vitest";
import { pool } from "@/db";
import { findLabWithRole } from "@/db/queries/members";
import { labWithTeam } from "./support/fixtures";

afterAll(() => pool.end());

describe("lab slugs", () => {
  it("resolve only when exactly equal", async () => {
    const { lab, people } = await labWithTeam();
    const userId = people.manager.id;
    expect((await findLabWithRole({ slug: lab.slug, userId }))?.role).toBe("manager");
    for (const slug of [lab.slug.toUpperCase(), `${lab.slug}\u0000`, `${lab.slug} `, ` ${lab.slug}`, `${lab.slug}\t`])
      expect(await findLabWithRole({ slug, userId }), JSON.stringify(slug)).toBeNull();
  });
});
