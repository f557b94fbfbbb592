// Finds what the app serves, from the source: route handlers (route.ts and friends under app/,
// their exported HTTP methods, with the URL pattern the folder gives them) and server actions
// (the exports of every module whose directive prologue says "use server", plus any inline
// "use server" function, which the matrix cannot call and therefore refuses). Parsed with the
// TypeScript compiler, so `export const x = …`, `export async function x` and `export { a as b }`
// are all seen.
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative, sep } from "node:path";
import ts from "typescript";

const HTTP_METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE", "HEAD", "OPTIONS"] as const;
const SOURCE = /\.(ts|tsx|js|jsx|mjs)$/;
const ROUTE_FILE = /^route\.(ts|tsx|js|jsx|mjs)$/;

export interface ScanResult {
  /** "GET /api/plants/[plantId]" */
  routes: string[];
  /** "app/(app)/bench/actions.ts#savePlant" */
  actions: string[];
  /** inline "use server" functions: "app/x/page.tsx#doIt" */
  inlineActions: string[];
}

function walk(dir: string, out: string[] = []): string[] {
  for (const name of readdirSync(dir)) {
    if (name === "node_modules" || name.startsWith(".")) continue;
    const full = join(dir, name);
    if (statSync(full).isDirectory()) walk(full, out);
    else if (SOURCE.test(name)) out.push(full);
  }
  return out;
}

const posix = (p: string) => p.split(sep).join("/");

/** The URL pattern of a route file: route groups "(x)" and parallel slots "@x" do not appear. */
export function routePattern(appRelativeDir: string): string {
  const segments = posix(appRelativeDir)
    .split("/")
    .filter((s) => s && !(s.startsWith("(") && s.endsWith(")")) && !s.startsWith("@"));
  return "/" + segments.join("/");
}

function hasModifier(node: ts.Node, kind: ts.SyntaxKind): boolean {
  return ts.canHaveModifiers(node) && (ts.getModifiers(node) ?? []).some((m) => m.kind === kind);
}

/** Names of the module's exported values (not types). */
function exportedValueNames(sf: ts.SourceFile): string[] {
  const names: string[] = [];
  for (const st of sf.statements) {
    if (ts.isExportDeclaration(st)) {
      if (st.isTypeOnly) continue;
      if (st.exportClause && ts.isNamedExports(st.exportClause)) {
        for (const el of st.exportClause.elements) if (!el.isTypeOnly) names.push(el.name.text);
      } else names.push("*"); // export * from …: unknown names, reported as such
      continue;
    }
    if (ts.isExportAssignment(st)) {
      names.push("default");
      continue;
    }
    if (!hasModifier(st, ts.SyntaxKind.ExportKeyword)) continue;
    const isDefault = hasModifier(st, ts.SyntaxKind.DefaultKeyword);
    if (ts.isFunctionDeclaration(st) || ts.isClassDeclaration(st)) names.push(isDefault ? "default" : (st.name?.text ?? "default"));
    else if (ts.isVariableStatement(st)) {
      for (const d of st.declarationList.declarations) if (ts.isIdentifier(d.name)) names.push(d.name.text);
    } else if (ts.isEnumDeclaration(st)) names.push(st.name.text);
  }
  return names;
}

function directives(statements: readonly ts.Statement[]): string[] {
  const out: string[] = [];
  for (const st of statements) {
    if (ts.isExpressionStatement(st) && ts.isStringLiteral(st.expression)) out.push(st.expression.text);
    else break;
  }
  return out;
}

function inlineServerFunctions(sf: ts.SourceFile): string[] {
  const found: string[] = [];
  const visit = (node: ts.Node) => {
    if ((ts.isFunctionDeclaration(node) || ts.isFunctionExpression(node) || ts.isArrowFunction(node) || ts.isMethodDeclaration(node)) && node.body && ts.isBlock(node.body)) {
      if (directives(node.body.statements).includes("use server")) {
        const name =
          node.name && ts.isIdentifier(node.name)
            ? node.name.text
            : ts.isVariableDeclaration(node.parent) && ts.isIdentifier(node.parent.name)
              ? node.parent.name.text
              : `<anonymous at line ${sf.getLineAndCharacterOfPosition(node.getStart(sf)).line + 1}>`;
        found.push(name);
      }
    }
    ts.forEachChild(node, visit);
  };
  visit(sf);
  return found;
}

/** Scans `dirs` (relative to root) for route handlers (under app/ only) and server actions. */
export function scanApp(root: string, dirs: readonly string[] = ["app", "components"]): ScanResult {
  const result: ScanResult = { routes: [], actions: [], inlineActions: [] };
  for (const dir of dirs) {
    let files: string[];
    try {
      files = walk(join(root, dir));
    } catch {
      continue; // the folder does not exist
    }
    for (const file of files) {
      const rel = posix(relative(root, file));
      const text = readFileSync(file, "utf8");
      const sf = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true, file.endsWith("x") ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
      const exported = exportedValueNames(sf);
      const base = rel.slice(rel.lastIndexOf("/") + 1);
      if (rel.startsWith("app/") && ROUTE_FILE.test(base)) {
        const pattern = routePattern(rel.slice("app/".length, rel.length - base.length));
        for (const name of exported) if ((HTTP_METHODS as readonly string[]).includes(name)) result.routes.push(`${name} ${pattern}`);
      }
      if (directives(sf.statements).includes("use server")) {
        for (const name of exported) result.actions.push(`${rel}#${name}`);
      } else if (text.includes("use server")) {
        for (const name of inlineServerFunctions(sf)) result.inlineActions.push(`${rel}#${name}`);
      }
    }
  }
  for (const list of Object.values(result)) list.sort();
  return result;
}
