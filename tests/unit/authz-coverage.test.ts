// Every route handler method and every server action must have a row in the authorization
// matrix (tests/authz/matrix.ts), and every row must point at code that exists.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";
import { ACTIONS, ALL_ROLES, ROUTES } from "../authz/matrix";

const ROOT = path.resolve(import.meta.dirname, "../..");
const HTTP = new Set(["GET", "POST", "PUT", "PATCH", "DELETE", "HEAD", "OPTIONS"]);

function walk(dir: string, keep: (f: string) => boolean): string[] {
  return readdirSync(path.join(ROOT, dir), { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile())
    .map((d) => path.relative(ROOT, path.join(d.parentPath, d.name)).split(path.sep).join("/"))
    .filter(keep);
}

const parse = (file: string) =>
  ts.createSourceFile(
    file,
    readFileSync(path.join(ROOT, file), "utf8"),
    ts.ScriptTarget.Latest,
    true,
    file.endsWith("x") ? ts.ScriptKind.TSX : ts.ScriptKind.TS,
  );
const exported = (node: ts.Node) =>
  ts.canHaveModifiers(node) && (ts.getModifiers(node) ?? []).some((m) => m.kind === ts.SyntaxKind.ExportKeyword);

/** Names of runtime (non-type) exports of a module. */
function runtimeExports(source: ts.SourceFile): string[] {
  const names: string[] = [];
  for (const st of source.statements) {
    if (ts.isFunctionDeclaration(st) && exported(st) && st.name) names.push(st.name.text);
    else if (ts.isVariableStatement(st) && exported(st)) {
      for (const d of st.declarationList.declarations) {
        if (ts.isIdentifier(d.name)) names.push(d.name.text);
        else if (ts.isObjectBindingPattern(d.name))
          for (const el of d.name.elements) if (ts.isIdentifier(el.name)) names.push(el.name.text);
      }
    } else if (ts.isExportDeclaration(st) && !st.isTypeOnly && st.exportClause && ts.isNamedExports(st.exportClause)) {
      for (const el of st.exportClause.elements) if (!el.isTypeOnly) names.push(el.name.text);
    } else if (ts.isExportAssignment(st)) names.push("default");
  }
  return names;
}

const isDirective = (st: ts.Statement | undefined, text: string) =>
  !!st && ts.isExpressionStatement(st) && ts.isStringLiteral(st.expression) && st.expression.text === text;

/** "use server" inside a function body (an inline action) rather than at the top of a file. */
function inlineServerDirectives(source: ts.SourceFile): number {
  let count = 0;
  const visit = (node: ts.Node) => {
    if (
      (ts.isFunctionLike(node) || ts.isArrowFunction(node)) &&
      "body" in node &&
      node.body &&
      ts.isBlock(node.body as ts.Node) &&
      isDirective((node.body as ts.Block).statements[0], "use server")
    )
      count++;
    ts.forEachChild(node, visit);
  };
  visit(source);
  return count;
}

const routeOf = (file: string) =>
  "/" +
  file
    .replace(/^app\//, "")
    .replace(/\/route\.(ts|js)$/, "")
    .split("/")
    .filter((seg) => !/^\(.*\)$/.test(seg))
    .join("/");

const sourceFiles = () => ["app", "lib", "components", "db"].flatMap((d) => walk(d, (f) => /\.(ts|tsx)$/.test(f)));

describe("authorization matrix coverage", () => {
  const listedRoutes = new Set(ROUTES.map((r) => `${r.method} ${r.route}`));

  it("lists every method every route handler under app/ exports (the API and the public pages served as plain HTML)", () => {
    const found: string[] = [];
    for (const file of walk("app", (f) => /\/route\.(ts|js)$/.test(f))) {
      for (const name of runtimeExports(parse(file))) if (HTTP.has(name)) found.push(`${name} ${routeOf(file)}`);
    }
    expect(found.length).toBeGreaterThan(0);
    const missing = found.filter((k) => !listedRoutes.has(k));
    expect(missing, "route handlers without a row in tests/authz/matrix.ts").toEqual([]);
    const stale = [...listedRoutes].filter((k) => !found.includes(k));
    expect(stale, "matrix rows for route handlers that do not exist").toEqual([]);
  });

  it('lists every server action a "use server" file exports, and there are no inline actions', () => {
    const found: string[] = [];
    const inline: string[] = [];
    for (const file of sourceFiles()) {
      const source = parse(file);
      if (isDirective(source.statements[0], "use server"))
        for (const name of runtimeExports(source)) found.push(`${file}#${name}`);
      if (inlineServerDirectives(source) > 0) inline.push(file);
    }
    expect(inline, 'inline "use server" functions: move them to a listed "use server" file').toEqual([]);
    const listed = new Set(ACTIONS.map((a) => `${a.file}#${a.name}`));
    expect(
      found.filter((k) => !listed.has(k)),
      "server actions without a row in tests/authz/matrix.ts",
    ).toEqual([]);
    expect(
      [...listed].filter((k) => !found.includes(k)),
      "matrix rows for server actions that do not exist",
    ).toEqual([]);
  }, 30_000);

  it("gives every walked row a status for anonymous and every role, and every exempt row a reason", () => {
    for (const row of ROUTES) {
      if (row.exempt !== undefined) {
        expect(row.exempt.length, `${row.method} ${row.route}: say why it is exempt`).toBeGreaterThan(10);
        expect(row.expect).toBeUndefined();
        continue;
      }
      expect(Object.keys(row.expect ?? {}).sort(), `${row.method} ${row.url}`).toEqual(
        ["anonymous", ...ALL_ROLES].sort(),
      );
    }
  });

  it("detects what it is meant to detect (checked on inline samples)", () => {
    const sample = ts.createSourceFile(
      "x.ts",
      `"use server";\nexport async function a() {}\nexport const { GET, POST } = h;\nexport const b = async () => {};\nexport type T = 1;\nfunction c() { "use server"; }`,
      ts.ScriptTarget.Latest,
      true,
    );
    expect(runtimeExports(sample)).toEqual(["a", "GET", "POST", "b"]);
    expect(inlineServerDirectives(sample)).toBe(1);
    expect(routeOf("app/api/v1/labs/[slug]/(group)/x/route.ts")).toBe("/api/v1/labs/[slug]/x");
  });
});
