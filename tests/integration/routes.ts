import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';

/** One exported method of one route handler file under app/api. */
export interface RouteHandler {
  method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  /** The path pattern, e.g. `/api/slots/[id]`. */
  pattern: string;
  /** The dynamic segments, e.g. `['id']`. */
  params: string[];
  file: string;
}

const METHODS = ['GET', 'POST', 'PATCH', 'PUT', 'DELETE'] as const;
const API_DIR = path.resolve(import.meta.dirname, '../../app/api');

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? files(full) : name === 'route.ts' ? [full] : [];
  });
}

/**
 * Every route handler of the app, read from the files under app/api, so a route added later is
 * covered without touching the tests. Methods are the exported GET/POST/PATCH/PUT/DELETE.
 */
export function routeHandlers(): RouteHandler[] {
  const out: RouteHandler[] = [];
  for (const file of files(API_DIR).sort()) {
    const source = readFileSync(file, 'utf8');
    const rel = path.relative(API_DIR, path.dirname(file)).split(path.sep).filter(Boolean);
    const pattern = `/api/${rel.join('/')}`.replace(/\/$/, '');
    const params = rel.filter((s) => s.startsWith('[')).map((s) => s.replace(/^\[(\.\.\.)?|\]$/g, ''));
    for (const method of METHODS) {
      const exported =
        new RegExp(`export\\s+(const|async\\s+function|function)\\s+${method}\\b`).test(source) ||
        new RegExp(`export\\s*\\{[^}]*\\bas\\s+${method}\\b`).test(source) ||
        new RegExp(`export\\s*\\{[^}]*\\b${method}\\b[^}]*\\}`).test(source);
      if (exported) out.push({ method, pattern, params, file: path.relative(process.cwd(), file) });
    }
  }
  return out;
}

/** The concrete path of a handler with its dynamic segments filled in. */
export function fillPath(pattern: string, values: Record<string, string>): string {
  return pattern.replace(/\[(\.\.\.)?([^\]]+)\]/g, (_, __, name: string) => encodeURIComponent(values[name] ?? 'x'));
}
