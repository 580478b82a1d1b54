import { describe, expect, it } from "vitest";
import { GET } from "@/app/api/v1/solve/route";
import { send, type Answer } from "../support/routes";

const solve = async (query: string) => {
  const { status, json } = await send<Answer & { warnings: string[] }>(GET, {}, { method: "GET", query: `?${query}` });
  return { status, body: json };
};

describe("GET /api/v1/solve", () => {
  it("solves the parent with Finet: 0.678 x (3.5 + 2.5) = 4.068 (Finet et al., EuroIntervention 2008)", async () => {
    const { status, body } = await solve("law=finet&mb=3.5&sb=2.5");
    expect(status).toBe(200);
    expect(body).toMatchObject({ law: "finet", solved: "parent" });
    expect(body.diameterMm).toBeCloseTo(4.068, 12);
    expect(body.diameterLabel).toBe("4.07"); // the one decimal-label function
    expect(body.formula).toContain("0.678");
    // SB/MB = 0.71, below the 0.75 where Finet's ratio fitted best (Huo et al. 2012).
    expect(body.warnings.join(" ")).toMatch(/fit/i);
  });

  it("has no warning inside Finet's published fit: 0.678 x (3.5 + 3.0) = 4.407", async () => {
    const { body } = await solve("law=finet&mb=3.5&sb=3");
    expect(body.diameterMm).toBeCloseTo(4.407, 12);
    expect(body.warnings).toEqual([]);
  });

  it("solves the side branch with Murray: (4^3 - 3.5^3)^(1/3) (Murray, PNAS 1926)", async () => {
    const { status, body } = await solve("law=murray&parent=4&mb=3.5");
    expect(status).toBe(200);
    expect(body.solved).toBe("sb");
    expect(body.diameterMm).toBeCloseTo(Math.cbrt(64 - 42.875), 12);
  });

  it("refuses input outside the meaningful geometry (400) and results outside it (422)", async () => {
    const tiny = await solve("law=murray&mb=0.001&sb=0.001");
    expect(tiny.status).toBe(400);
    expect(tiny.body.error.issues.map((i) => i.path[0])).toEqual(["mb", "sb"]);
    for (const key of ["__proto__", "constructor"]) {
      const r = await solve(`law=murray&mb=3&sb=2&${key}=1`);
      expect(r.status, key).toBe(400);
      expect(r.body.error.issues).toEqual([{ path: [key], message: "Unknown query parameter" }]);
    }
    // A parent 0.0002 mm above the main branch (Finet: 0.678 x (4 + 1.9) = 4.0002) is no bifurcation.
    const flat = await solve("law=finet&mb=4&sb=1.9");
    expect(flat.status).toBe(422);
    expect(flat.body.error.message).toMatch(/Not a bifurcation/);
    // Murray: (0.65^3 - 0.58^3)^(1/3) = 0.43 mm, a side branch below the meaningful 0.5 mm.
    const thin = await solve("law=murray&parent=0.65&mb=0.58");
    expect(thin.status).toBe(422);
    expect(thin.body.error.message).toMatch(/outside the meaningful 0.5-10 mm/);
  });

  it("a power law needs n within 1.5..3.5", async () => {
    expect((await solve("law=power&n=2.3&mb=3&sb=2")).status).toBe(200);
    const missing = await solve("law=power&mb=3&sb=2");
    expect(missing.status).toBe(400);
    expect(missing.body.error.issues.map((i) => i.path[0])).toContain("n");
    expect((await solve("law=power&n=4&mb=3&sb=2")).status).toBe(400);
  });

  it.each([
    ["missing a diameter", "law=murray&mb=3", ""],
    ["three diameters", "law=murray&parent=4&mb=3&sb=2", ""],
    ["a non-number", "law=murray&mb=abc&sb=2", "mb"],
    ["NaN", "law=murray&mb=NaN&sb=2", "mb"],
    ["Infinity", "law=murray&mb=Infinity&sb=2", "mb"],
    ["zero", "law=murray&mb=0&sb=2", "mb"],
    ["negative", "law=murray&mb=-3&sb=2", "mb"],
    ["over 10 mm", "law=murray&mb=10.5&sb=2", "mb"],
    ["an unknown law", "law=cube&mb=3&sb=2", "law"],
    ["a ratio out of range", "law=finet&ratio=0.9&mb=3&sb=2", "ratio"],
    ["a ratio on a law without one", "law=murray&ratio=0.7&mb=3&sb=2", "ratio"],
    ["an over-long value", `law=murray&mb=3.${"0".repeat(30)}&sb=2`, "mb"],
    ["an unknown key", "law=murray&mb=3&sb=2&x=1", "x"],
  ])("400 for %s, naming the field", async (_name, query, field) => {
    const { status, body } = await solve(query);
    expect(status).toBe(400);
    expect(body.error.code).toBe("invalid_input");
    expect(body.error.message.length).toBeGreaterThan(0);
    expect(body.error.issues.length).toBeGreaterThan(0);
    if (field) expect(body.error.issues.map((i) => i.path[0])).toContain(field);
  });

  it.each([
    ["Finet parent below the main branch (side branch under 0.47 of it)", "law=finet&mb=4&sb=1"],
    ["a side branch larger than the main branch", "law=square&mb=2&sb=3"],
    ["a main branch at or above the parent", "law=murray&parent=3&mb=3.2"],
  ])("422 no_solution for %s, never a number", async (_name, query) => {
    const { status, body } = await solve(query);
    expect(status).toBe(422);
    expect(body.error.code).toBe("no_solution");
    expect(body.error.message).toMatch(/\w/);
    expect(body.diameterMm).toBeUndefined();
  });
});
