import { readFileSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

const MUTATING_METHODS = ['POST', 'PUT', 'PATCH', 'DELETE'] as const;
export const ALL_METHODS = ['GET', ...MUTATING_METHODS] as const;

export interface ApiRoute {
  method: string;
  /** The route's path with its [segments], e.g. `/api/recipes/[id]/versions`. */
  path: string;
  /** The route file's source, for checks on how it is built. */
  source: string;
}

const API_DIR = path.resolve('app/api');

/**
 * Every handler exported by a route file under app/api, found on disk so a new one cannot be
 * forgotten (`export const POST`, `export async function POST`, `export { handler as POST }`).
 */
export function apiRoutes(methods: readonly string[] = MUTATING_METHODS): ApiRoute[] {
  const found: ApiRoute[] = [];
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const full = path.join(dir, name);
      if (statSync(full).isDirectory()) walk(full);
      else if (name === 'route.ts') {
        const source = readFileSync(full, 'utf8');
        const routePath = `/api/${path.relative(API_DIR, dir).split(path.sep).join('/')}`;
        for (const method of methods) {
          const exported = new RegExp(
            `export\\s+(const|async\\s+function|function)\\s+${method}\\b|export\\s*\\{[^}]*\\bas\\s+${method}\\b[^}]*\\}|export\\s*\\{[^}]*\\b${method}\\b[^}]*\\}`,
          ).test(source);
          if (exported) found.push({ method, path: routePath, source });
        }
      }
    }
  };
  walk(API_DIR);
  return found.sort((a, b) => `${a.method} ${a.path}`.localeCompare(`${b.method} ${b.path}`));
}

/** `METHOD /api/...` for every mutating handler. */
export function mutatingRouteKeys(): string[] {
  return apiRoutes().map((r) => `${r.method} ${r.path}`);
}
