/**
 * Results use Float64Array for speed; JSON.stringify turns a typed array into an object keyed by
 * index. `run` of a ModelSpec returns wire data, so typed arrays are turned into plain number arrays
 * there (recursively, leaving everything else as is).
 */
export type Plain<T> = T extends Float64Array
  ? number[]
  : T extends readonly (infer U)[]
    ? Plain<U>[]
    : T extends object
      ? { [K in keyof T]: Plain<T[K]> }
      : T;

export function toPlain<T>(value: T): Plain<T> {
  if (value instanceof Float64Array) return Array.from(value) as Plain<T>;
  if (Array.isArray(value)) return value.map((v) => toPlain(v)) as Plain<T>;
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(value)) out[k] = toPlain(v);
    return out as Plain<T>;
  }
  return value as Plain<T>;
}
