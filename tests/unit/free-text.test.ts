import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { acceptNewAccountSchema } from "@/lib/validation/auth";
import { chartPatchSchema } from "@/lib/validation/chart";
import { rejectEditionSchema, withdrawEditionSchema } from "@/lib/validation/edition";
import { roomSchema } from "@/lib/validation/room";
import { stentPlatformInput } from "@/lib/validation/stock";
import { freeText } from "@/lib/validation/text";

// Finding 10: one text schema for every free-text field.
const BAD = {
  "a lone surrogate": "Cath \uD800 lab",
  "a lone low surrogate": "Cath \uDC00 lab",
  NUL: "Room\u00001",
  "an escape character": "Room \u001b[31m",
  "a C1 control": "Room \u0085 1",
  "a right-to-left override": "Room \u202Egnp.exe",
  "a bidi isolate": "Room \u2066A\u2069",
};

const FIELDS: [string, z.ZodType, (s: string) => unknown, string][] = [
  ["room name", roomSchema, (s) => ({ name: s }), "name"],
  ["chart title", chartPatchSchema, (s) => ({ title: s }), "title"],
  ["chart notes", chartPatchSchema, (s) => ({ notes: s }), "notes"],
  ["reject reason", rejectEditionSchema, (s) => ({ reason: `Because ${s}` }), "reason"],
  ["withdraw reason", withdrawEditionSchema, (s) => ({ reason: s }), "reason"],
  ["platform name", stentPlatformInput, (s) => ({ name: s }), "name"],
  [
    "account name",
    acceptNewAccountSchema,
    (s) => ({ token: "a".repeat(43), name: s, password: "long-enough-pass-2026", confirm: "long-enough-pass-2026" }),
    "name",
  ],
];

describe("free text", () => {
  for (const [field, schema, body, key] of FIELDS) {
    it(`${field}: refuses each hidden or breaking character, naming the field`, () => {
      for (const [what, text] of Object.entries(BAD)) {
        const r = schema.safeParse(body(text));
        expect(r.success, `${field} with ${what}`).toBe(false);
        expect(
          r.error!.issues.some((i) => i.path[0] === key),
          `${field} with ${what}`,
        ).toBe(true);
      }
    });
    it(`${field}: stores NFC-normalised, trimmed text`, () => {
      const r = schema.safeParse(body("  Cafe\u0301 lab  "));
      expect(r.success).toBe(true);
      const value = (r.data as Record<string, string>)[key]!;
      expect(value.endsWith("Caf\u00e9 lab")).toBe(true);
    });
  }

  it("keeps line breaks only in multi-line fields, normalising CRLF", () => {
    const notes = freeText({ what: "Notes", max: 50, multiline: true });
    expect(notes.parse("one\r\ntwo\rthree")).toBe("one\ntwo\nthree");
    expect(freeText({ what: "Name", max: 50 }).safeParse("one\ntwo").success).toBe(false);
    expect(freeText({ what: "Name", max: 50 }).safeParse("a\tb").success).toBe(false);
  });

  it("counts length after normalisation, and accepts ordinary Unicode (emoji, accents, CJK)", () => {
    const name = freeText({ what: "Name", min: 1, max: 5 });
    expect(name.parse("e\u0301e\u0301e\u0301e\u0301e\u0301")).toBe("\u00e9\u00e9\u00e9\u00e9\u00e9");
    expect(freeText({ what: "Name", max: 40 }).parse("Salle 2 — 導管室 🫀")).toBe("Salle 2 — 導管室 🫀");
  });

  it("is the schema of every free-text field in lib/validation (no bare z.string().trim())", () => {
    const dir = path.resolve("lib/validation");
    for (const file of readdirSync(dir)) {
      if (file === "text.ts") continue;
      const src = readFileSync(path.join(dir, file), "utf8");
      // e-mail addresses are not free text: they are checked as addresses.
      const bare = src.replace(/emailField = z[^;]*;/, "").match(/z\s*\.string\([^)]*\)\s*\.trim\(\)/g);
      expect(bare, file).toBeNull();
    }
  });
});
