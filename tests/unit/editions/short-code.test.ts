import { describe, expect, it } from "vitest";
import {
  SHORT_CODE_ALPHABET,
  SHORT_CODE_BITS,
  formatShortCode,
  newShortCode,
  parseShortCode,
} from "@/lib/editions/short-code";

// Crockford's Base32 (https://www.crockford.com/base32.html): 32 symbols, no I, L, O or U.
describe("short codes", () => {
  it("carry at least 40 random bits in an alphabet without look-alike letters", () => {
    expect(SHORT_CODE_ALPHABET).toHaveLength(32);
    expect(new Set(SHORT_CODE_ALPHABET).size).toBe(32);
    for (const ch of "ILOU") expect(SHORT_CODE_ALPHABET).not.toContain(ch);
    expect(SHORT_CODE_BITS).toBeGreaterThanOrEqual(40);
  });

  it("are drawn evenly enough that 2,000 of them do not repeat and use the whole alphabet", () => {
    const codes = Array.from({ length: 2000 }, newShortCode);
    expect(new Set(codes).size).toBe(codes.length);
    expect(new Set(codes.join("")).size).toBe(32);
    for (const code of codes) expect(parseShortCode(code)).toBe(code);
  });

  it("print in two groups and read back however they are typed", () => {
    expect(formatShortCode("K7QM2XHD")).toBe("K7QM-2XHD");
    expect(parseShortCode("k7qm-2xhd")).toBe("K7QM2XHD");
    expect(parseShortCode(" K7QM 2XHD ")).toBe("K7QM2XHD");
    expect(parseShortCode("1O0L-IIII")).toBe("1001" + "1111");
  });

  it("refuse anything that cannot be a code", () => {
    for (const bad of ["", "K7QM-2XH", "K7QM-2XHDD", "K7QM-2XHU", "K7QM/2XHD", "x".repeat(40)])
      expect(parseShortCode(bad)).toBeNull();
  });
});
