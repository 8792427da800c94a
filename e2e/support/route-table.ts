import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';

const routerFile = fileURLToPath(new URL('../../client/src/router/index.ts', import.meta.url));

export interface RouteEntry {
  name: string;
  /** The full path pattern, e.g. /staff/fitments/:id */
  path: string;
}

/**
 * The SPA's route names and paths as its router declares them. The router module imports Vue components, which
 * Node cannot load, so its source is read with the TypeScript parser: the exported `routeNames` list, and every
 * `{ path, name }` record with the paths of the layouts around it.
 */
export function readRouteTable(): { names: string[]; routes: RouteEntry[] } {
  const source = ts.createSourceFile(routerFile, readFileSync(routerFile, 'utf8'), ts.ScriptTarget.ES2022, true);
  const names: string[] = [];
  const routes: RouteEntry[] = [];
  const text = (n: ts.Node | undefined) => (n && (ts.isStringLiteral(n) || ts.isNoSubstitutionTemplateLiteral(n)) ? n.text : undefined);
  const prop = (o: ts.ObjectLiteralExpression, key: string) =>
    o.properties.find((p): p is ts.PropertyAssignment => ts.isPropertyAssignment(p) && ts.isIdentifier(p.name) && p.name.text === key)?.initializer;
  const unwrap = (e: ts.Expression): ts.Expression => (ts.isAsExpression(e) || ts.isSatisfiesExpression(e) || ts.isParenthesizedExpression(e) ? unwrap(e.expression) : e);

  function walkRoute(o: ts.ObjectLiteralExpression, parent: string) {
    const path = text(prop(o, 'path'));
    if (path === undefined) return;
    const full = path.startsWith('/') ? path : `${parent.replace(/\/$/, '')}/${path}`.replace(/\/$/, '') || '/';
    const name = text(prop(o, 'name'));
    if (name) routes.push({ name, path: full === '' ? '/' : full });
    const kids = prop(o, 'children');
    if (kids) {
      const list = unwrap(kids);
      if (ts.isArrayLiteralExpression(list)) for (const k of list.elements) if (ts.isObjectLiteralExpression(k)) walkRoute(k, full);
    }
  }

  ts.forEachChild(source, function visit(node) {
    if (ts.isVariableDeclaration(node) && ts.isIdentifier(node.name) && node.initializer) {
      const init = unwrap(node.initializer);
      if (node.name.text === 'routeNames' && ts.isArrayLiteralExpression(init)) {
        for (const e of init.elements) if (text(e)) names.push(text(e)!);
      }
      // The records under the shell: a list of route objects.
      if (node.name.text === 'children' && ts.isArrayLiteralExpression(init)) {
        for (const e of init.elements) if (ts.isObjectLiteralExpression(e)) walkRoute(e, '/');
      }
    }
    ts.forEachChild(node, visit);
  });
  if (!names.length || !routes.length) throw new Error(`Could not read the routes of ${routerFile}`);
  return { names, routes };
}

/** Vue Router's ranking in short: a fixed segment beats a parameter, which beats a catch-all. */
function score(path: string): number {
  return path.split('/').filter(Boolean).reduce((s, seg) => s + (seg.includes('(.*)') ? 0 : seg.startsWith(':') ? 2 : 3), 0);
}

function pattern(path: string): RegExp {
  const body = path
    .split('/')
    .filter(Boolean)
    .map((seg) => (seg.includes('(.*)') ? '(?:/.*)?' : seg.startsWith(':') ? '/[^/]+' : `/${seg.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`))
    .join('');
  return new RegExp(`^${body || '/'}/?$`);
}

/** The name of the route a path lands on, as the router would pick it. */
export function routeOf(routes: RouteEntry[], pathname: string): string | undefined {
  const hits = routes.filter((r) => pattern(r.path).test(pathname)).sort((a, b) => score(b.path) - score(a.path));
  return hits[0]?.name;
}
