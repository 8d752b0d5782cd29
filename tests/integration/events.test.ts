import { afterAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '@/db';
import { db } from '@/db/models';
import { changeMarkOf, currentVersion, onChange, recordChange, type ChangeNotice } from '@/lib/events';

afterAll(async () => {
  await getSequelize().close();
});

async function coopId(): Promise<string> {
  const coop = await db().Cooperative.findOne({ where: { name: 'Larkspur Hollow Sugar Cooperative' } });
  if (!coop) throw new Error('demo co-op missing');
  return coop.id;
}

/** Rejects when `p` has not settled within `ms`: a write that waits on another's lock. */
function within<T>(p: Promise<T>, ms: number, what: string): Promise<T> {
  let timer: ReturnType<typeof setTimeout>;
  return Promise.race([
    p.finally(() => clearTimeout(timer)),
    new Promise<never>((_, reject) => {
      timer = setTimeout(() => reject(new Error(`${what} did not finish within ${ms} ms`)), ms);
    }),
  ]);
}

describe('lib/events', () => {
  it('bumps the version as the writer’s transaction commits and tells listeners only after', async () => {
    const { sequelize } = db();
    const cooperativeId = await coopId();
    const before = await currentVersion(sequelize, cooperativeId);
    const heard: ChangeNotice[] = [];
    const off = onChange((n) => {
      heard.push(n);
    });
    try {
      await sequelize.transaction(async (transaction) => {
        await recordChange({ cooperativeId, transaction }, { type: 'delivery.accepted', deliveryId: 'd1', householdId: 'h1' });
        // Two changes in one transaction make one step of the version.
        await recordChange({ cooperativeId, transaction }, { type: 'delivery.rejected', deliveryId: 'd3', householdId: 'h1' });
        expect(heard).toHaveLength(0);
        // Not yet visible to anyone else, nor counted inside.
        expect(await currentVersion(sequelize, cooperativeId)).toBe(before);
      });
      expect(heard).toEqual([
        { cooperativeId, event: { type: 'delivery.accepted', deliveryId: 'd1', householdId: 'h1' } },
        { cooperativeId, event: { type: 'delivery.rejected', deliveryId: 'd3', householdId: 'h1' } },
      ]);
      expect(await currentVersion(sequelize, cooperativeId)).toBe(before + 1);
      const [{ n }] = await sequelize.query<{ n: string }>('SELECT count(*) AS n FROM change_marks', { type: QueryTypes.SELECT });
      expect(Number(n)).toBe(0);
    } finally {
      off();
    }
  });

  it('a write of one statement bumps the version once as it commits, and not when it wrote nothing', async () => {
    const { sequelize } = db();
    const cooperativeId = await coopId();
    const before = await currentVersion(sequelize, cooperativeId);
    // Every household of the co-op is touched: several rows, one co-op, one step.
    const touch = (where: string) =>
      sequelize.query<{ id: string }>(
        `WITH touched AS (UPDATE households SET name = name WHERE cooperative_id = :cooperativeId AND ${where} RETURNING id, cooperative_id),
              marked AS (${changeMarkOf('touched')})
         SELECT id FROM touched`,
        { replacements: { cooperativeId }, type: QueryTypes.SELECT },
      );
    expect((await touch('true')).length).toBeGreaterThan(1);
    expect(await currentVersion(sequelize, cooperativeId)).toBe(before + 1);
    expect(await touch('false')).toHaveLength(0);
    expect(await currentVersion(sequelize, cooperativeId)).toBe(before + 1);
    const [{ n }] = await sequelize.query<{ n: string }>('SELECT count(*) AS n FROM change_marks', { type: QueryTypes.SELECT });
    expect(Number(n)).toBe(0);
  });

  it('a rolled-back write tells nobody and leaves the version', async () => {
    const { sequelize } = db();
    const cooperativeId = await coopId();
    const before = await currentVersion(sequelize, cooperativeId);
    const heard: ChangeNotice[] = [];
    const off = onChange((n) => {
      heard.push(n);
    });
    try {
      await expect(
        sequelize.transaction(async (transaction) => {
          await recordChange({ cooperativeId, transaction }, { type: 'delivery.rejected', deliveryId: 'd2', householdId: 'h1' });
          throw new Error('roll back');
        }),
      ).rejects.toThrow('roll back');
      expect(heard).toHaveLength(0);
      expect(await currentVersion(sequelize, cooperativeId)).toBe(before);
    } finally {
      off();
    }
  });

  it('a change to a co-op that does not exist fails its transaction', async () => {
    const { sequelize } = db();
    await expect(
      sequelize.transaction(async (transaction) => {
        await recordChange({ cooperativeId: randomUUID(), transaction }, { type: 'settings.changed' });
      }),
    ).rejects.toThrow(/no cooperative/);
  });

  it('every committed writer adds one, concurrent writers included', async () => {
    const { sequelize } = db();
    const cooperativeId = await coopId();
    const before = await currentVersion(sequelize, cooperativeId);
    await Promise.all(
      Array.from({ length: 8 }, (_, i) =>
        sequelize.transaction((transaction) =>
          recordChange({ cooperativeId, transaction }, { type: 'delivery.accepted', deliveryId: `c${i}`, householdId: 'h' }),
        ),
      ),
    );
    expect(await currentVersion(sequelize, cooperativeId)).toBe(before + 8);
  });

  it('a writer’s open transaction does not hold up another writer of the same co-op', async () => {
    // The version's row lock is taken at commit: a slow writer (one still busy after recording
    // its change) must not queue the co-op's other writes behind it.
    const { sequelize } = db();
    const cooperativeId = await coopId();
    const before = await currentVersion(sequelize, cooperativeId);
    let releaseSlow!: () => void;
    const slowMayCommit = new Promise<void>((resolve) => (releaseSlow = resolve));
    let slowRecorded!: () => void;
    const recorded = new Promise<void>((resolve) => (slowRecorded = resolve));
    const slow = sequelize.transaction(async (transaction) => {
      await recordChange({ cooperativeId, transaction }, { type: 'settings.changed' });
      slowRecorded();
      await slowMayCommit;
    });
    try {
      await recorded;
      await within(
        sequelize.transaction((transaction) => recordChange({ cooperativeId, transaction }, { type: 'settings.changed' })),
        5_000,
        'the second writer',
      );
      expect(await currentVersion(sequelize, cooperativeId)).toBe(before + 1);
    } finally {
      releaseSlow();
      await slow;
    }
    expect(await currentVersion(sequelize, cooperativeId)).toBe(before + 2);
  });
});
