/**
 * Dotted attribute paths, as the engine reads nested documents: `info.comment` names the
 * `comment` field inside the `info` object (or inside each object of an `info` array), and also
 * a top-level key spelled `info.comment`. Declaring a parent (`info`) covers every field below it.
 */
import type { Document } from './store';

function collect(value: unknown, path: string, out: unknown[]): void {
  if (Array.isArray(value)) {
    for (const item of value) collect(item, path, out);
    return;
  }
  if (typeof value !== 'object' || value === null) return;
  for (const [key, inner] of Object.entries(value)) {
    if (key === path) out.push(inner);
    else if (path.startsWith(`${key}.`)) collect(inner, path.slice(key.length + 1), out);
  }
}

/** Every value stored at `path` in `doc`; empty when the document has nothing there. */
export function valuesAtPath(doc: Document, path: string): unknown[] {
  const out: unknown[] = [];
  collect(doc, path, out);
  return out;
}

/** The value at `path` in the shape the lookups expect: undefined, the one value, or a list of them. */
export function valueAtPath(doc: Document, path: string): unknown {
  const values = valuesAtPath(doc, path);
  if (values.length === 0) return undefined;
  return values.length === 1 ? values[0] : values;
}

/** Whether a declared attribute (`*`, the path itself, or one of its parents) covers `path`. */
export function covers(declared: readonly string[], path: string): boolean {
  return declared.some((name) => name === '*' || name === path || path.startsWith(`${name}.`));
}

function select(value: unknown, paths: readonly string[]): Document | Document[] | undefined {
  if (Array.isArray(value)) {
    return value
      .filter((item) => typeof item === 'object' && item !== null)
      .map((item) => select(item, paths) as Document)
      .filter((item) => Object.keys(item).length > 0);
  }
  if (typeof value !== 'object' || value === null) return undefined;
  const out: Document = {};
  for (const [key, inner] of Object.entries(value)) {
    if (paths.includes(key)) {
      out[key] = inner;
      continue;
    }
    const below = paths.filter((path) => path.startsWith(`${key}.`)).map((path) => path.slice(key.length + 1));
    if (below.length === 0) continue;
    const picked = select(inner, below);
    if (picked !== undefined && Object.keys(picked).length > 0) out[key] = picked;
  }
  return out;
}

/** The document cut down to `paths` (nested paths keep their parents' shape); `*` keeps everything. */
export function selectPaths(doc: Document, paths: readonly string[] | null): Document {
  if (!paths || paths.includes('*')) return { ...doc };
  return select(doc, paths) as Document;
}
