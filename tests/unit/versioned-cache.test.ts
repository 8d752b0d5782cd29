import { describe, expect, it } from 'vitest';
import { deepFreeze, keptJson, processCache, VersionedCache } from '@/lib/server/versioned-cache';

const counter = () => {
  let builds = 0;
  return {
    build: (value: string) => async () => {
      builds += 1;
      return value;
    },
    get builds() {
      return builds;
    },
  };
};

describe('VersionedCache', () => {
  it('builds once per version and again when the version grows', async () => {
    const cache = new VersionedCache<string>(100, (v) => v.length);
    const c = counter();
    expect(await cache.get('coop:season', '7', c.build('at 7'))).toBe('at 7');
    expect(await cache.get('coop:season', '7', c.build('again at 7'))).toBe('at 7');
    expect(c.builds).toBe(1);
    expect(await cache.get('coop:season', '8', c.build('at 8'))).toBe('at 8');
    expect(c.builds).toBe(2);
    expect(cache.stats()).toEqual({ entries: 1, weight: 4 });
  });

  it('answers a caller that read an older version with the newer value it holds', async () => {
    const cache = new VersionedCache<string>(100, (v) => v.length);
    const c = counter();
    await cache.get('k', 12n, c.build('at 12'));
    expect(await cache.get('k', 11, c.build('at 11'))).toBe('at 12');
    expect(c.builds).toBe(1);
  });

  it('builds once for callers that ask at the same time', async () => {
    const cache = new VersionedCache<string>(100, (v) => v.length);
    let builds = 0;
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    const build = async () => {
      builds += 1;
      await gate;
      return 'built';
    };
    const asked = Promise.all([cache.get('k', '3', build), cache.get('k', '3', build), cache.get('k', '2', build)]);
    release();
    expect(await asked).toEqual(['built', 'built', 'built']);
    expect(builds).toBe(1);
  });

  it('keeps no failed build: the next caller builds again', async () => {
    const cache = new VersionedCache<string>(100, (v) => v.length);
    await expect(
      cache.get('k', '1', async () => {
        throw new Error('database went away');
      }),
    ).rejects.toThrow('database went away');
    expect(await cache.get('k', '1', async () => 'second try')).toBe('second try');
  });

  it('drops the least recently used past its weight, and never keeps one heavier than that', async () => {
    const cache = new VersionedCache<string>(10, (v) => v.length);
    const c = counter();
    await cache.get('a', 1, c.build('aaaa'));
    await cache.get('b', 1, c.build('bbbb'));
    await cache.get('a', 1, c.build('unused')); // a is now the most recently used
    await cache.get('c', 1, c.build('cccc')); // 12 > 10: b goes
    expect(cache.stats()).toEqual({ entries: 2, weight: 8 });
    await cache.get('b', 1, c.build('bbbb'));
    expect(c.builds).toBe(4);
    expect(await cache.get('huge', 1, c.build('x'.repeat(11)))).toHaveLength(11);
    await cache.get('huge', 1, c.build('x'.repeat(11)));
    expect(c.builds).toBe(6);
  });
});

describe('deepFreeze', () => {
  it('freezes nested objects and arrays so a shared answer cannot be edited', () => {
    const v = deepFreeze({ households: [{ name: 'Ash', syrup: { golden: 1 } }] });
    expect(() => {
      (v.households[0].syrup as { golden: number }).golden = 2;
    }).toThrow(TypeError);
    expect(() => (v.households as unknown[]).push({})).toThrow(TypeError);
  });
});

describe('VersionedCache.peek', () => {
  it('answers only what was built at the version asked for or later, and builds nothing', async () => {
    const cache = new VersionedCache<string>(100, (v) => v.length);
    expect(cache.peek('k', 1)).toBeUndefined();
    await cache.get('k', 5, async () => 'at 5');
    expect(cache.peek('k', '4')).toBe('at 5');
    expect(cache.peek('k', '5')).toBe('at 5');
    expect(cache.peek('k', '6')).toBeUndefined();
    expect(cache.peek('other', '0')).toBeUndefined();
  });
});

describe('VersionedCache.keep and processCache', () => {
  it('keeps a value built elsewhere at its version, unless a newer one is kept already', () => {
    const cache = new VersionedCache<string>(100, (v) => v.length);
    expect(cache.keep('k', '4', 'at 4')).toBe('at 4');
    expect(cache.peek('k', 4)).toBe('at 4');
    expect(cache.keep('k', '3', 'at 3')).toBe('at 4');
    expect(cache.keep('k', '5', 'at 5')).toBe('at 5');
    expect(cache.stats()).toEqual({ entries: 1, weight: 4 });
  });

  it('gives every caller in the process the same cache for a name', () => {
    const a = processCache<string>('versioned-cache-test', 10, (v) => v.length);
    a.keep('k', 1, 'one');
    expect(processCache<string>('versioned-cache-test', 10, (v) => v.length).peek('k', 1)).toBe('one');
    expect(processCache<string>('versioned-cache-test-other', 10, (v) => v.length).peek('k', 1)).toBeUndefined();
  });
});

describe('keptJson', () => {
  it('keeps a GET answer’s text per version, and builds afresh without a version or inside a transaction', async () => {
    const cache = new VersionedCache<string>(1000, (v) => v.length);
    let builds = 0;
    const build = async () => ({ lots: ++builds });
    expect(await keptJson(cache, 'coop|all', { knownVersion: '3' }, build)).toBe('{"lots":1}');
    expect(await keptJson(cache, 'coop|all', { knownVersion: '3' }, build)).toBe('{"lots":1}');
    expect(await keptJson(cache, 'coop|all', { knownVersion: '4' }, build)).toBe('{"lots":2}');
    // A write's own transaction may hold changes nobody else sees yet: never kept or served kept.
    expect(await keptJson(cache, 'coop|all', { knownVersion: '4', transaction: {} }, build)).toBe('{"lots":3}');
    expect(await keptJson(cache, 'coop|all', {}, build)).toBe('{"lots":4}');
    expect(cache.peek('coop|all', '4')).toBe('{"lots":2}');
  });
});
