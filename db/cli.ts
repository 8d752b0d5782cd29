import { getSequelize } from '@/db';
import { createMigrator } from '@/db/migrator';
import { db } from '@/db/models';
import { seedDemo, truncateAll } from '@/db/seeds/demo';
import { assertDisposable } from '@/db/guard';
import { seedScale } from '@/db/seeds/scale';

/**
 * npm run db:migrate | db:rollback [-- --to 0] | db:seed [-- --reset | --scale N]. Emptying commands
 * (`seed --reset`, `rollback --to 0`) touch only a database named …_test unless `--force`.
 */
async function main() {
  const [command, ...args] = process.argv.slice(2);
  const force = args.includes('--force');
  const sequelize = getSequelize();
  const migrator = createMigrator(sequelize, { quiet: args.includes('--quiet') });
  try {
    if (command === 'migrate') {
      const done = await migrator.up();
      console.log(done.length ? `Applied ${done.length} migration(s).` : 'Database is up to date.');
    } else if (command === 'rollback') {
      const toZero = args.includes('--to') && args[args.indexOf('--to') + 1] === '0';
      if (toZero) assertDisposable(sequelize, 'roll back every migration of', { force });
      const undone = await migrator.down(toZero ? { to: 0 } : undefined);
      console.log(`Rolled back ${undone.length} migration(s).`);
    } else if (command === 'seed' && args.includes('--scale')) {
      const scale = Number(args[args.indexOf('--scale') + 1]);
      const started = Date.now();
      const seeded = await seedScale(sequelize, scale);
      const rows = Object.entries(seeded.counts).map(([t, n]) => `${n} ${t}`).join(', ');
      console.log(`Generated the ×${scale} co-op in ${((Date.now() - started) / 1000).toFixed(1)} s: ${rows}.`);
      console.log(`Sign in as ${seeded.coordinatorEmail} or ${seeded.memberEmail} (password: ${seeded.password}).`);
    } else if (command === 'seed') {
      const { Cooperative } = db();
      if (args.includes('--reset')) await truncateAll({ force });
      else if ((await Cooperative.count()) > 0) {
        console.log('Demo data already loaded; leaving the database as it is.');
        return;
      }
      await seedDemo();
      console.log('Loaded the demo co-op (Larkspur Hollow Sugar Cooperative).');
    } else {
      console.error('usage: db/cli.ts migrate | rollback [--to 0] [--force] | seed [--reset] [--force]');
      process.exitCode = 2;
    }
  } finally {
    await sequelize.close();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
