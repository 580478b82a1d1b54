// The layer rules in eslint.config.mjs fail the lint (and so `npm test`) on a wrong-direction
// import or an import cycle: each case plants a file in the folder it names (removed afterwards)
// and lints it with ESLint's own Node API.
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { ESLint } from "eslint";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");
const eslint = new ESLint({ cwd: root });

const planted: string[] = [];
afterAll(() => planted.forEach((dir) => rmSync(dir, { recursive: true, force: true })));
// The first lint resolves the whole import graph once (cached for the rest): minutes on a busy machine.
beforeAll(() => eslint.lintFiles([path.join(root, "lib/ops/operation.ts")]), 300_000);

/** The rules a file with `code` breaks when it stands at `file` (its folder gets a fresh subfolder). */
async function rulesHit(file: string, code: string, dir = plantDir(path.dirname(file))): Promise<string[]> {
  const at = path.join(dir, path.basename(file));
  writeFileSync(at, code);
  const [result] = await eslint.lintFiles([at]);
  return result!.messages.filter((m) => m.severity === 2).map((m) => m.ruleId ?? m.message);
}

function plantDir(folder: string): string {
  const dir = mkdtempSync(path.join(root, folder, "planted-"));
  planted.push(dir);
  return dir;
}

describe("layer rules", () => {
  it.each([
    ["components/planted.tsx", 'import { db } from "@/db";'],
    ["app/(lab)/page.tsx", 'import { listMembers } from "@/db/queries/members";'],
    ["db/queries/planted.ts", 'import { labOperation } from "@/lib/ops/operation";'],
    ["db/queries/planted.ts", 'import { hashToken } from "@/lib/auth/tokens";'],
    ["db/queries/planted.ts", 'import { clientAddress } from "../../lib/http/client-address";'],
    ["lib/charts/planted.ts", 'import { labOperation } from "../ops/operation";'],
    ["lib/charts/planted.ts", 'import { db } from "@/db";'],
    ["lib/sizing/planted.ts", 'import { redirect } from "next/navigation";'],
    ["lib/format/planted.ts", 'import { useState } from "react";'],
  ])("%s may not import: %s", async (file, line) => {
    expect(await rulesHit(file, `${line}\nexport const planted = 1;\n`)).toContain("no-restricted-imports");
  });

  it("allows the right direction: lib/ops imports the query layer and pure lib/", async () => {
    const code =
      'import { db } from "@/db";\nimport { can } from "@/lib/permissions";\nexport const planted = [db, can];\n';
    expect(await rulesHit("lib/ops/planted.ts", code)).toEqual([]);
  });
});

describe("import cycles", () => {
  it("fails on two modules that import each other", async () => {
    const dir = plantDir("lib");
    writeFileSync(path.join(dir, "b.ts"), 'import { a } from "./a";\nexport const b = () => a;\n');
    const hit = await rulesHit("lib/a.ts", 'import { b } from "./b";\nexport const a = () => b;\n', dir);
    expect(hit).toContain("import/no-cycle");
  });
});
