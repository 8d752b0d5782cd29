/**
 * Answers that are costly to build and change only when their co-op changes, kept per key with
 * the change version they were built at (a number that only grows, as a decimal string).
 *
 * A caller reads the current version first and asks for the value at that version: a value built
 * at that version or a later one is returned as it is (it holds every change up to the version
 * asked for); otherwise it is built once, however many callers ask at the same time, and kept.
 * A failed build is not kept. Values are weighed; the least recently used go first when the
 * total passes `maxWeight`, and one heavier than that is returned but never kept.
 */
export class VersionedCache<V> {
  private readonly entries = new Map<string, { version: bigint; value: V; weight: number }>();
  private readonly building = new Map<string, { version: bigint; promise: Promise<V> }>();
  private total = 0;

  constructor(
    private readonly maxWeight: number,
    private readonly weigh: (value: V) => number,
  ) {}

  async get(key: string, version: string | number | bigint, build: () => Promise<V>): Promise<V> {
    const v = BigInt(version);
    const kept = this.entries.get(key);
    if (kept && kept.version >= v) {
      this.entries.delete(key); // most recently used last
      this.entries.set(key, kept);
      return kept.value;
    }
    const pending = this.building.get(key);
    if (pending && pending.version >= v) return pending.promise;

    const promise = build();
    this.building.set(key, { version: v, promise });
    try {
      return this.keep(key, v, await promise);
    } finally {
      if (this.building.get(key)?.promise === promise) this.building.delete(key);
    }
  }

  /**
   * Keeps a value already built at `version` (when the version was read together with it) and
   * returns what is kept now: that value, or a newer one that was kept first.
   */
  keep(key: string, version: string | number | bigint, value: V): V {
    const v = BigInt(version);
    const old = this.entries.get(key);
    if (old && old.version >= v) return old.value; // a newer build finished first
    if (old) {
      this.entries.delete(key);
      this.total -= old.weight;
    }
    const weight = this.weigh(value);
    if (weight > this.maxWeight) return value;
    this.entries.set(key, { version: v, value, weight });
    this.total += weight;
    for (const [k, e] of this.entries) {
      if (this.total <= this.maxWeight) break;
      this.entries.delete(k);
      this.total -= e.weight;
    }
    return value;
  }

  /** The value kept for `key` if it was built at `version` or later; nothing is built. */
  peek(key: string, version: string | number | bigint): V | undefined {
    const kept = this.entries.get(key);
    if (!kept || kept.version < BigInt(version)) return undefined;
    this.entries.delete(key);
    this.entries.set(key, kept);
    return kept.value;
  }

  /** Entries kept and their total weight (for tests and the benchmark). */
  stats(): { entries: number; weight: number } {
    return { entries: this.entries.size, weight: this.total };
  }
}

/**
 * A GET answer's JSON text, kept in `cache` under `key` per co-op change version. `knownVersion`
 * is the version read with the signed-in person in this request (nothing written since); without
 * it, or inside a caller's transaction, the answer is built afresh and not kept. The answer is
 * read after the version was, so one built at it holds every change up to it.
 */
export async function keptJson(
  cache: VersionedCache<string>,
  key: string,
  { knownVersion, transaction }: { knownVersion?: string; transaction?: unknown },
  build: () => Promise<unknown>,
): Promise<string> {
  const text = async () => JSON.stringify(await build());
  if (!knownVersion || transaction) return text();
  return cache.get(key, knownVersion, text);
}

/**
 * One cache per process under `name`, on globalThis so that server.ts and the route handlers'
 * and pages' bundles share it.
 */
export function processCache<V>(name: string, maxWeight: number, weigh: (value: V) => number): VersionedCache<V> {
  const caches = ((globalThis as unknown as { __brixhouseCaches?: Map<string, VersionedCache<unknown>> }).__brixhouseCaches ??= new Map());
  let cache = caches.get(name) as VersionedCache<V> | undefined;
  if (!cache) caches.set(name, (cache = new VersionedCache<V>(maxWeight, weigh)) as VersionedCache<unknown>);
  return cache;
}

/** Freezes a plain data tree, so a value shared between requests cannot be changed by one. */
export function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const child of Object.values(value as Record<string, unknown>)) deepFreeze(child);
  }
  return value;
}
