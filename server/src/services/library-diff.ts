import type { DiffChange } from 'wick-core';

/** Numeric arrays longer than this are compared whole and shown as a one-line summary. */
const SUMMARY_AFTER = 12;

function summarise(values: readonly number[]): string {
  const fmt = (v: number) => Number(v.toPrecision(4)).toString();
  return `${values.length} values (${fmt(values[0])} … ${fmt(values[values.length - 1])})`;
}

function flatten(value: unknown, path: string, out: Map<string, unknown>): void {
  if (Array.isArray(value)) {
    if (value.every((v) => typeof v === 'number')) {
      out.set(path, value);
      return;
    }
    if (value.length === 0) {
      out.set(path, []);
      return;
    }
    value.forEach((v, i) => flatten(v, `${path}[${i}]`, out));
    return;
  }
  if (value !== null && typeof value === 'object') {
    const keys = Object.keys(value as object).sort();
    if (keys.length === 0) out.set(path, {});
    for (const k of keys) flatten((value as Record<string, unknown>)[k], path ? `${path}.${k}` : k, out);
    return;
  }
  if (value !== undefined) out.set(path, value);
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);
const shown = (v: unknown) => (Array.isArray(v) && v.length > SUMMARY_AFTER ? summarise(v as number[]) : v);

/**
 * Leaf-by-leaf differences between two JSON documents (paths like `data.basisWeight.si`, `data.blend[1].massFraction`).
 * Long numeric arrays (distributions, curves) are compared whole and reported as a summary.
 */
export function jsonDiff(before: unknown, after: unknown): DiffChange[] {
  const a = new Map<string, unknown>();
  const b = new Map<string, unknown>();
  flatten(before, '', a);
  flatten(after, '', b);
  const paths = [...new Set([...a.keys(), ...b.keys()])].sort();
  const changes: DiffChange[] = [];
  for (const path of paths) {
    const had = a.has(path);
    const has = b.has(path);
    if (had && has && same(a.get(path), b.get(path))) continue;
    changes.push({ path, ...(had ? { before: shown(a.get(path)) } : {}), ...(has ? { after: shown(b.get(path)) } : {}) });
  }
  return changes;
}
