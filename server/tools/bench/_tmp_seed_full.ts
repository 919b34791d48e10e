import { benchDatabase } from '../bench-database';
import { createDb } from '../../data/db';
import { migrate } from '../db-setup';
import { seedLarge } from '../large-data/seed-large';
const bdb = await benchDatabase();
console.log('URL', bdb.url);
const db = createDb(bdb.url);
await migrate(db);
const n = await db('users').count({ n: '*' }).first();
if (Number((n as { n: number }).n) === 0) {
  const s = await seedLarge(db, { scale: 1, log: console.log });
  console.log(JSON.stringify(s.counts));
}
await db.destroy();
