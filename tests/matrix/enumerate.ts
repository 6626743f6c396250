import fs from "node:fs";
import path from "node:path";
import ts from "typescript";

/*
 * Finds every route handler and server action by parsing the source (TypeScript's own parser),
 * not by matching text: `export async function PUT`, `export { h as DELETE }`,
 * `export const { GET, POST } = …`, a "use server" directive after a comment, and inline
 * "use server" functions are all seen. The checks are pure functions returning the problems
 * they find, so tests/unit/security/enumerate.test.ts can prove they fail on synthetic files.
 */

export const HTTP_METHODS = ["GET", "HEAD", "POST", "PUT", "DELETE", "PATCH", "OPTIONS"] as const;
export type HttpMethod = (typeof HTTP_METHODS)[number];
export const WRITE_METHODS: HttpMethod[] = ["POST", "PUT", "DELETE", "PATCH"];

/** How an exported name gets its value. */
export type ExportKind =
  | { kind: "call"; callee: string } // export const POST = withApi(…)
  | { kind: "function"; body: string } // export async function f() {…} or export const f = async () => …
  | { kind: "destructured" } // export const { GET, POST } = handlers
  | { kind: "reexport" } // export { a as POST } / export { POST } from "…"
  | { kind: "other" };

export type ModuleExports = { names: Map<string, ExportKind>; starExport: boolean };

const parse = (file: string, text: string) => ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true, file.endsWith("x") ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
const isExported = (node: ts.Node) => ts.canHaveModifiers(node) && (ts.getModifiers(node) ?? []).some((m) => m.kind === ts.SyntaxKind.ExportKeyword);

function bindingNames(name: ts.BindingName, out: string[] = []): string[] {
  if (ts.isIdentifier(name)) out.push(name.text);
  else for (const el of name.elements) if (!ts.isOmittedExpression(el)) bindingNames(el.name, out);
  return out;
}

function kindOf(init: ts.Expression | undefined, sf: ts.SourceFile): ExportKind {
  let e = init;
  while (e && (ts.isAsExpression(e) || ts.isSatisfiesExpression(e) || ts.isParenthesizedExpression(e))) e = e.expression;
  if (!e) return { kind: "other" };
  if (ts.isCallExpression(e)) return { kind: "call", callee: e.expression.getText(sf) };
  if (ts.isArrowFunction(e) || ts.isFunctionExpression(e)) return { kind: "function", body: e.body.getText(sf) };
  return { kind: "other" };
}

export function moduleExports(file: string, text: string): ModuleExports {
  const sf = parse(file, text);
  const names = new Map<string, ExportKind>();
  let starExport = false;
  for (const st of sf.statements) {
    if (ts.isVariableStatement(st) && isExported(st)) {
      for (const d of st.declarationList.declarations) {
        if (ts.isIdentifier(d.name)) names.set(d.name.text, kindOf(d.initializer, sf));
        else for (const n of bindingNames(d.name)) names.set(n, { kind: "destructured" });
      }
    } else if ((ts.isFunctionDeclaration(st) || ts.isClassDeclaration(st)) && isExported(st)) {
      const isDefault = (ts.getModifiers(st) ?? []).some((m) => m.kind === ts.SyntaxKind.DefaultKeyword);
      const name = isDefault ? "default" : (st.name?.text ?? "default");
      names.set(name, ts.isFunctionDeclaration(st) && st.body ? { kind: "function", body: st.body.getText(sf) } : { kind: "other" });
    } else if (ts.isExportDeclaration(st)) {
      if (!st.exportClause) starExport = true;
      else if (ts.isNamespaceExport(st.exportClause)) names.set(st.exportClause.name.text, { kind: "reexport" });
      else for (const el of st.exportClause.elements) names.set(el.name.text, { kind: "reexport" });
    } else if (ts.isExportAssignment(st)) {
      names.set("default", kindOf(st.expression, sf));
    }
  }
  return { names, starExport };
}

/** True when the file's directive prologue holds "use server" (comments may come before it). */
export function isServerActionFile(file: string, text: string): boolean {
  const sf = parse(file, text);
  for (const st of sf.statements) {
    if (!ts.isExpressionStatement(st) || !ts.isStringLiteral(st.expression)) return false;
    if (st.expression.text === "use server") return true;
  }
  return false;
}

/** Functions with their own "use server" directive inside a body: server actions the file scan would not see. */
export function inlineServerActions(file: string, text: string): string[] {
  const sf = parse(file, text);
  const found: string[] = [];
  const visit = (node: ts.Node) => {
    if ((ts.isFunctionDeclaration(node) || ts.isFunctionExpression(node) || ts.isArrowFunction(node) || ts.isMethodDeclaration(node)) && node.body && ts.isBlock(node.body)) {
      const first = node.body.statements[0];
      if (first && ts.isExpressionStatement(first) && ts.isStringLiteral(first.expression) && first.expression.text === "use server") {
        const { line } = sf.getLineAndCharacterOfPosition(node.getStart(sf));
        found.push(`${file}:${line + 1}`);
      }
    }
    ts.forEachChild(node, visit);
  };
  visit(sf);
  return found;
}

export function walk(root: string, dir: string, out: string[] = []): string[] {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(root, p, out);
    else out.push(path.relative(root, p).split(path.sep).join("/"));
  }
  return out;
}

export const isRouteFile = (file: string) => /(^|\/)route\.(ts|tsx|js|jsx|mjs)$/.test(file);
export const isSource = (file: string) => /\.(ts|tsx|js|jsx|mjs)$/.test(file) && !/\.d\.ts$/.test(file);

/** app/api/v1/ovens/[ovenId]/route.ts → /api/v1/ovens/[ovenId] (route groups in parentheses drop out). */
export function urlPathOf(file: string): string {
  const parts = file.replace(/^app\//, "").split("/").slice(0, -1).filter((p) => !/^\(.*\)$/.test(p));
  return "/" + parts.join("/");
}
export const dynamicSegments = (file: string) => [...file.matchAll(/\[(?:\.\.\.)?(\w+)\]/g)].map((m) => m[1]);

export type MatrixEntry = { method: string; file: string };
export type RoutePolicy = {
  matrix: MatrixEntry[];
  /** The sign-in library's own endpoints: `export const { GET, POST } = handlers`. */
  framework: string[];
  /** Routes checking a secret instead of a role, and the wrapper each must use. */
  secretChecked: { match: (file: string) => boolean; wrapper: string }[];
  /** Routes answering everyone with a plain function (the health check). */
  publicFunctions: string[];
};

/** What is wrong with one route file: unlisted methods, unwrapped handlers, hidden exports. */
export function routeProblems(file: string, text: string, policy: RoutePolicy): string[] {
  const problems: string[] = [];
  const { names, starExport } = moduleExports(file, text);
  if (starExport) problems.push(`${file}: "export * from" hides which methods it handles; export them by name`);
  const methods = [...names.keys()].filter((n): n is HttpMethod => (HTTP_METHODS as readonly string[]).includes(n));
  if (policy.framework.includes(file)) {
    for (const m of methods) if (names.get(m)!.kind !== "destructured") problems.push(`${m} ${file}: expected the sign-in library's handlers`);
    return problems;
  }
  if (methods.length === 0) problems.push(`${file}: no HTTP method exported`);
  const secret = policy.secretChecked.find((s) => s.match(file));
  for (const m of methods) {
    if (!policy.matrix.some((r) => r.file === file && r.method === m)) problems.push(`${m} ${file} missing from tests/matrix/routes.ts`);
    const k = names.get(m)!;
    const wrapper = secret?.wrapper ?? "withApi";
    if (k.kind === "function" && policy.publicFunctions.includes(`${m} ${file}`)) continue;
    if (k.kind !== "call" || k.callee !== wrapper) problems.push(`${m} ${file}: must be \`export const ${m} = ${wrapper}(…)\` (found ${k.kind === "call" ? k.callee + "(…)" : k.kind})`);
  }
  return problems;
}

/** Matrix rows whose file or method no longer exists. */
export function staleMatrixRows(matrix: MatrixEntry[], read: (file: string) => string | null): string[] {
  return matrix
    .filter((r) => {
      const text = read(r.file);
      return text === null || !moduleExports(r.file, text).names.has(r.method);
    })
    .map((r) => `${r.method} ${r.file} is in the matrix but not in the code`);
}

/** Imported local name → module it comes from. */
export function importSources(file: string, text: string): Map<string, string> {
  const out = new Map<string, string>();
  for (const st of parse(file, text).statements) {
    if (!ts.isImportDeclaration(st) || !ts.isStringLiteral(st.moduleSpecifier) || !st.importClause) continue;
    const from = st.moduleSpecifier.text;
    if (st.importClause.name) out.set(st.importClause.name.text, from);
    const b = st.importClause.namedBindings;
    if (b && ts.isNamedImports(b)) for (const el of b.elements) out.set(el.name.text, from);
  }
  return out;
}

/** What is wrong with one "use server" file: an exported function that skips the wrapper. */
export function actionProblems(file: string, text: string, publicActions: Set<string>): string[] {
  const problems: string[] = [];
  const { names, starExport } = moduleExports(file, text);
  const imports = importSources(file, text);
  if (starExport) problems.push(`${file}: "export * from" in a "use server" file exposes actions no test sees`);
  for (const [name, k] of names) {
    const id = `${file}#${name}`;
    if (k.kind !== "function") {
      problems.push(`${id}: every export of a "use server" file must be a function defined there (found ${k.kind})`);
      continue;
    }
    if (publicActions.has(id)) {
      // Public actions still validate what they are sent (or take nothing, like sign-out).
      if (!/safeParse\(|signOut\(/.test(k.body)) problems.push(`${id}: a public action must validate its input`);
      continue;
    }
    const def = /\binvokeAction\(\s*(\w+Def)\s*,/.exec(k.body)?.[1];
    if (!def) problems.push(`${id}: must call invokeAction(fooDef, …) so the wrapper checks the role`);
    // Definitions live in lib/actions/, which the action matrix test loads in full.
    else if (!/^@\/lib\/actions\/[\w-]+$/.test(imports.get(def) ?? "")) problems.push(`${id}: ${def} must be imported from @/lib/actions/<entity>`);
  }
  return problems;
}
