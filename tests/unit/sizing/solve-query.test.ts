import { errorBody, invalidInput } from "@/lib/errors";
import { describe, expect, it } from "vitest";
import { parseSolveQuery, queryRecord, solveQuerySchema, type QueryIssue } from "@/lib/validation/solve";

const parse = (query: string) => parseSolveQuery(queryRecord(new URLSearchParams(query)));

function issues(query: string): QueryIssue[] {
  const r = parse(query);
  if (r.success) throw new Error(`expected a 400 for ${query}`);
  return r.issues;
}
function pathsOf(query: string): string[] {
  return issues(query).map((i) => JSON.stringify(i.path));
}

describe("valid solve queries", () => {
  it("parse to the right spec and known diameters", () => {
    expect(parse("law=murray&mb=3&sb=2")).toEqual({
      success: true,
      data: { spec: { law: "murray" }, known: { mb: 3, sb: 2 } },
    });
    expect(parse("law=finet&parent=4.068&mb=3.5")).toEqual({
      success: true,
      data: { spec: { law: "finet", ratio: 0.678 }, known: { parent: 4.068, mb: 3.5 } },
    });
    expect(parse("law=finet&ratio=0.7&parent=4&sb=2.5")).toMatchObject({
      data: { spec: { law: "finet", ratio: 0.7 }, known: { parent: 4, sb: 2.5 } },
    });
    expect(parse("law=huo-kassab&parent=4&mb=3")).toMatchObject({
      data: { spec: { law: "huo-kassab" } },
    });
    expect(parse("law=square&parent=5&sb=3")).toMatchObject({ data: { spec: { law: "square" } } });
    expect(parse("law=power&n=2.3&mb=3&sb=2")).toMatchObject({
      data: { spec: { law: "power", n: 2.3 } },
    });
  });

  it("accepts the bounds", () => {
    expect(parse("law=power&n=1.5&mb=10&sb=0.5").success).toBe(true);
    expect(parse("law=power&n=3.5&mb=3&sb=2").success).toBe(true);
    expect(parse("law=finet&ratio=0.55&mb=3&sb=2").success).toBe(true);
    expect(parse("law=finet&ratio=0.80&mb=3&sb=2").success).toBe(true);
    expect(parse("law=murray&mb=.75&sb=0.5").success).toBe(true);
  });

  it("leaves impossible geometry to the solver (not a 400)", () => {
    expect(parse("law=murray&mb=2&sb=3").success).toBe(true);
  });
});

describe("400 cases", () => {
  it("not exactly two diameters", () => {
    const msg = "Give exactly two of parent, mb, sb";
    expect(issues("law=murray&mb=3")).toEqual([{ path: [], message: msg }]);
    expect(issues("law=murray")).toEqual([{ path: [], message: msg }]);
    expect(issues("law=murray&parent=4&mb=3&sb=2")).toEqual([{ path: [], message: msg }]);
  });

  it("non-numbers, NaN, Infinity, exponents, blanks", () => {
    for (const bad of ["abc", "NaN", "Infinity", "-Infinity", "1e1", "0x3", " 3", "3 ", "", "3,5", "3.5mm", "."]) {
      expect(issues(`law=murray&mb=${encodeURIComponent(bad)}&sb=2`), bad).toEqual([
        { path: ["mb"], message: "Must be a plain decimal number, e.g. 3.5" },
      ]);
    }
  });

  it("zero, negative and above 10 mm", () => {
    expect(issues("law=murray&mb=0&sb=2")).toEqual([{ path: ["mb"], message: "Must be greater than 0 mm" }]);
    expect(issues("law=murray&mb=3&sb=-1")).toEqual([{ path: ["sb"], message: "Must be greater than 0 mm" }]);
    expect(issues("law=murray&parent=10.01&sb=2")).toEqual([{ path: ["parent"], message: "Must be at most 10 mm" }]);
    expect(parse("law=murray&parent=10&sb=2").success).toBe(true);
  });

  it("below the meaningful 0.5 mm (a 0.001 mm vessel is no vessel)", () => {
    expect(issues("law=murray&mb=0.001&sb=0.001")).toEqual([
      { path: ["mb"], message: "Must be at least 0.5 mm" },
      { path: ["sb"], message: "Must be at least 0.5 mm" },
    ]);
    expect(issues("law=murray&mb=3&sb=0.49")).toEqual([{ path: ["sb"], message: "Must be at least 0.5 mm" }]);
  });

  it("unknown or missing law", () => {
    expect(pathsOf("law=cube&mb=3&sb=2")).toEqual(['["law"]']);
    expect(pathsOf("law=Murray&mb=3&sb=2")).toEqual(['["law"]']);
    expect(pathsOf("mb=3&sb=2")).toEqual(['["law"]']);
  });

  it("power without n, or n out of range or not a number", () => {
    expect(pathsOf("law=power&mb=3&sb=2")).toEqual(['["n"]']);
    expect(pathsOf("law=power&n=1.49&mb=3&sb=2")).toEqual(['["n"]']);
    expect(pathsOf("law=power&n=3.51&mb=3&sb=2")).toEqual(['["n"]']);
    expect(pathsOf("law=power&n=abc&mb=3&sb=2")).toEqual(['["n"]']);
  });

  it("n given for a law that fixes it", () => {
    for (const law of ["murray", "huo-kassab", "square", "finet"]) {
      expect(pathsOf(`law=${law}&n=3&mb=3&sb=2`), law).toEqual(['["n"]']);
    }
    expect(issues("law=murray&n=3&mb=3&sb=2")[0]?.message).toBe("Murray fixes n at 3; leave n out");
  });

  it("ratio out of range or for a law other than Finet", () => {
    expect(pathsOf("law=finet&ratio=0.54&mb=3&sb=2")).toEqual(['["ratio"]']);
    expect(pathsOf("law=finet&ratio=0.81&mb=3&sb=2")).toEqual(['["ratio"]']);
    expect(pathsOf("law=finet&ratio=x&mb=3&sb=2")).toEqual(['["ratio"]']);
    expect(pathsOf("law=murray&ratio=0.7&mb=3&sb=2")).toEqual(['["ratio"]']);
    expect(pathsOf("law=power&n=2.3&ratio=0.7&mb=3&sb=2")).toEqual(['["ratio"]']);
  });

  it("values longer than 16 characters", () => {
    const long = "3.00000000000001"; // 16 characters: accepted
    expect(long).toHaveLength(16);
    expect(parse(`law=murray&mb=${long}&sb=2`).success).toBe(true);
    expect(issues(`law=murray&mb=${long}0&sb=2`)).toEqual([
      { path: ["mb"], message: "Too long (at most 16 characters)" },
    ]);
    expect(pathsOf(`law=power&n=2.${"3".repeat(20)}&mb=3&sb=2`)).toEqual(['["n"]']);
    expect(pathsOf(`law=${"m".repeat(17)}&mb=3&sb=2`)).toEqual(['["law"]']);
  });

  it("unknown and repeated query keys", () => {
    expect(issues("law=murray&mb=3&sb=2&foo=1")).toEqual([{ path: ["foo"], message: "Unknown query parameter" }]);
    expect(pathsOf("law=murray&mb=3&sb=2&__proto__=1")).toEqual(['["__proto__"]']);
    expect(pathsOf("law=murray&mb=3&sb=2&constructor=1")).toEqual(['["constructor"]']);
    expect(pathsOf("law=murray&mb=3&sb=2&toString=1&hasOwnProperty=1")).toEqual(['["toString"]', '["hasOwnProperty"]']);
    expect(pathsOf("law=murray&mb=3&sb=2&MB=3")).toEqual(['["MB"]']);
    expect(issues("law=murray&mb=3&mb=3.5&sb=2")).toEqual([{ path: ["mb"], message: "Give this parameter once" }]);
  });

  it("reports every problem at once", () => {
    expect(pathsOf("law=cube&mb=abc&sb=0&x=1")).toEqual(['["x"]', '["law"]', '["mb"]', '["sb"]']);
  });

  it("rejects a non-record input", () => {
    expect(solveQuerySchema.safeParse("law=murray").success).toBe(false);
    expect(solveQuerySchema.safeParse(null).success).toBe(false);
  });
});

describe("HTTP 400 body", () => {
  it("has the error code, a message naming the field, and the issues", () => {
    const list = issues("law=murray&mb=0&sb=2");
    expect(errorBody(invalidInput(list))).toEqual({
      error: {
        code: "invalid_input",
        message: "mb: Must be greater than 0 mm",
        issues: [{ path: ["mb"], message: "Must be greater than 0 mm" }],
      },
    });
    expect(errorBody(invalidInput(issues("law=cube&mb=0&sb=2"))).error.message).toMatch(/^2 problems; first, /);
  });
});
