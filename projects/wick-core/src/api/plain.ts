/** T with every typed array replaced by number[] (what JSON.stringify should see). */
export type Plain<T> = T extends Float64Array | Float32Array | Int32Array | Uint16Array
  ? number[]
  : T extends readonly (infer U)[]
    ? Plain<U>[]
    : T extends object
      ? { [K in keyof T]: Plain<T[K]> }
      : T;

/**
 * Copy of a result with typed arrays turned into plain arrays, for JSON (JSON.stringify writes a
 * Float64Array as an object with numeric keys). Web Workers should post the typed arrays instead.
 */
export function toPlain<T>(value: T): Plain<T> {
  if (ArrayBuffer.isView(value) && !(value instanceof DataView)) {
    return Array.from(value as unknown as ArrayLike<number>) as Plain<T>;
  }
  if (Array.isArray(value)) return value.map((v) => toPlain(v)) as Plain<T>;
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(value)) out[k] = toPlain(v);
    return out as Plain<T>;
  }
  return value as Plain<T>;
}
