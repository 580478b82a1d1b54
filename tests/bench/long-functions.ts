// Lists functions longer than a limit (default 120 lines), longest first:
// `npx tsx tests/bench/long-functions.ts [limit]`. Reads app, components, lib and db.
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import ts from "typescript";

const limit = Number(process.argv[2] ?? 120);
const files = execFileSync("git", ["ls-files", "app", "components", "lib", "db"], { encoding: "utf8" })
  .split("\n")
  .filter((f) => /\.(ts|tsx)$/.test(f));

const found: { name: string; file: string; lines: number }[] = [];
for (const file of files) {
  const source = ts.createSourceFile(file, readFileSync(file, "utf8"), ts.ScriptTarget.Latest, true);
  const line = (pos: number) => source.getLineAndCharacterOfPosition(pos).line;
  const visit = (node: ts.Node) => {
    if (ts.isFunctionLike(node) && "body" in node && node.body) {
      const lines = line(node.getEnd()) - line(node.getStart()) + 1;
      if (lines > limit) {
        const named = node as ts.FunctionLikeDeclaration;
        const parent = node.parent;
        const name =
          named.name?.getText() ??
          (ts.isVariableDeclaration(parent) ? parent.name.getText() : ts.isCallExpression(parent) ? "(callback)" : "?");
        found.push({ name, file: `${file}:${line(node.getStart()) + 1}`, lines });
      }
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
}
for (const f of found.sort((a, b) => b.lines - a.lines))
  console.log(`${String(f.lines).padStart(4)}  ${f.name}  ${f.file}`);
console.log(`${found.length} function(s) over ${limit} lines`);
