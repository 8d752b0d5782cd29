import { afterAll, describe, expect, it } from 'vitest';
import { getSequelize } from '@/db';
import { db } from '@/db/models';
import { currentVersion, onChange, recordChange, type ChangeNotice } from '@/lib/events';

afterAll(async () => {
  await getSequelize().close();
});

async function coopId(): Promise<string> {
  const coop = await db().Cooperative.findOne({ where: { name: 'Larkspur Hollow Sugar Cooperative' } });
  if (!coop) throw new Error('demo co-op missing');
  return coop.id;
}

describe('lib/events', () => {
  it('bumps the version in the writer’s transaction and tells listeners only after commit', async () => {
    const { sequelize } = db();
    const cooperativeId = await coopId();
    const before = await currentVersion(sequelize, cooperativeId);
    const heard: ChangeNotice[] = [];
    const off = onChange((n) => {
      heard.push(n);
    });
    try {
      let versionInside = 0;
      await sequelize.transaction(async (transaction) => {
        versionInside = await recordChange({ cooperativeId, transaction }, { type: 'delivery.accepted', deliveryId: 'd1', householdId: 'h1' });
        expect(heard).toHaveLength(0);
      });
      expect(versionInside).toBe(before + 1);
      expect(heard).toEqual([{ cooperativeId, version: before + 1, event: { type: 'delivery.accepted', deliveryId: 'd1', householdId: 'h1' } }]);
      expect(await currentVersion(sequelize, cooperativeId)).toBe(before + 1);
    } finally {
      off();
    }
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

  it('versions only grow under concurrent writers', async () => {
    const { sequelize } = db();
    const cooperativeId = await coopId();
    const before = await currentVersion(sequelize, cooperativeId);
    const versions = await Promise.all(
      Array.from({ length: 8 }, (_, i) =>
        sequelize.transaction((transaction) =>
          recordChange({ cooperativeId, transaction }, { type: 'delivery.accepted', deliveryId: `c${i}`, householdId: 'h' }),
        ),
      ),
    );
    expect([...versions].sort((a, b) => a - b)).toEqual(Array.from({ length: 8 }, (_, i) => before + 1 + i));
  });
});
