import { describe, expect, it } from "vitest";
import { AXIS_MAX_MM, AXIS_MAX_VALUES, AXIS_MIN_MM, resolveAxis } from "@/lib/sizing/axis";

function values(r: ReturnType<typeof resolveAxis>): number[] {
  if (!r.ok) throw new Error(r.reason);
  return r.values;
}

describe("axis from a range", () => {
  it("steps in exact hundredths", () => {
    expect(values(resolveAxis({ from: 2.25, to: 2.75, step: 0.25 }))).toEqual([2.25, 2.5, 2.75]);
    const tenths = values(resolveAxis({ from: 0.5, to: 3.4, step: 0.1 }));
    expect(tenths).toHaveLength(30);
    expect(tenths[2]).toBe(0.7); // 0.5 + 0.1 + 0.1 in floating point is 0.7000000000000001
    expect(tenths[29]).toBe(3.4);
    expect(values(resolveAxis({ from: 3, to: 3, step: 0.5 }))).toEqual([3]);
  });

  it("rejects ranges that do not land on `to`, run backwards, or have no step", () => {
    expect(resolveAxis({ from: 2, to: 4.1, step: 0.25 })).toEqual({
      ok: false,
      reason: "Steps of 0.25 mm from 2.00 mm do not land on 4.10 mm",
    });
    expect(resolveAxis({ from: 4, to: 2, step: 0.25 }).ok).toBe(false);
    expect(resolveAxis({ from: 2, to: 4, step: 0 }).ok).toBe(false);
    expect(resolveAxis({ from: 2, to: 4, step: -0.25 }).ok).toBe(false);
    expect(resolveAxis({ from: 2, to: 4, step: 0.125 }).ok).toBe(false);
  });

  it("allows at most 30 values", () => {
    expect(AXIS_MAX_VALUES).toBe(30);
    expect(resolveAxis({ from: 1, to: 4, step: 0.1 })).toMatchObject({
      ok: false,
      reason: expect.stringContaining("31"),
    });
  });
});

describe("axis from a list", () => {
  it("keeps an ascending list of hundredths", () => {
    expect(values(resolveAxis([2, 2.5, 3.25, 4]))).toEqual([2, 2.5, 3.25, 4]);
  });

  it("rejects empty, unordered, repeated, off-grid and non-finite lists", () => {
    expect(resolveAxis([]).ok).toBe(false);
    expect(resolveAxis([3, 2.5]).ok).toBe(false);
    expect(resolveAxis([2.5, 2.5]).ok).toBe(false);
    expect(resolveAxis([2.125]).ok).toBe(false);
    expect(resolveAxis([Number.NaN]).ok).toBe(false);
    expect(resolveAxis([Infinity]).ok).toBe(false);
    expect(resolveAxis(Array.from({ length: 31 }, (_, i) => 1 + i / 10)).ok).toBe(false);
  });
});

describe("bounds 0.5..10 mm", () => {
  it("accepts the bounds and rejects beyond them", () => {
    expect([AXIS_MIN_MM, AXIS_MAX_MM]).toEqual([0.5, 10]);
    expect(values(resolveAxis([0.5, 10]))).toEqual([0.5, 10]);
    expect(resolveAxis([0.49]).ok).toBe(false);
    expect(resolveAxis([10.01]).ok).toBe(false);
    expect(resolveAxis({ from: 9.5, to: 10.5, step: 0.5 }).ok).toBe(false);
  });
});
