// Database chores: npm run db:migrate | db:migrate:undo | db:seed | db:seed:undo
import { databaseLabel, sequelize } from '@/lib/db';
import { migrator, seeder } from '@/lib/migrator';

const commands: Record<string, () => Promise<string[]>> = {
  migrate: async () => (await migrator(sequelize).up()).map((m) => `migrated ${m.name}`),
  'migrate:undo': async () => (await migrator(sequelize).down()).map((m) => `reverted ${m.name}`),
  'migrate:undo:all': async () => (await migrator(sequelize).down({ to: 0 })).map((m) => `reverted ${m.name}`),
  seed: async () => (await seeder(sequelize).up()).map((m) => `seeded ${m.name}`),
  'seed:undo': async () => (await seeder(sequelize).down({ to: 0 })).map((m) => `unseeded ${m.name}`),
};

async function main() {
  const command = process.argv[2] ?? '';
  const run = commands[command];
  if (!run) {
    console.error(`Usage: tsx scripts/db.ts <${Object.keys(commands).join('|')}>`);
    process.exit(2);
  }
  const done = await run();
  console.log(`${databaseLabel()}: ${done.length ? done.join('\n  ') : 'nothing to do'}`);
  await sequelize.close();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
