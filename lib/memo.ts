/**
 * A bounded in-memory cache, least recently used out first (a Map's insertion order, refreshed
 * on every hit). Only for values keyed by exactly what they were made from, so an entry can be
 * dropped at any time and never be wrong. Kept on globalThis under `name`, so development's hot
 * reloads keep one cache instead of leaking a new one per reload.
 */
export interface BoundedCache<V> {
  get(key: string): V | undefined;
  set(key: string, value: V): void;
  readonly size: number;
}

export function boundedCache<V>(name: string, max: number): BoundedCache<V> {
  const g = globalThis as unknown as Record<string, Map<string, V> | undefined>;
  const slot = `__synledger_${name}`;
  const map = (g[slot] ??= new Map<string, V>());
  return {
    get(key) {
      const hit = map.get(key);
      if (hit !== undefined) {
        map.delete(key);
        map.set(key, hit);
      }
      return hit;
    },
    set(key, value) {
      map.set(key, value);
      if (map.size > max) map.delete(map.keys().next().value!);
    },
    get size() {
      return map.size;
    },
  };
}
