import { db, pool } from '../client';
import { applyMigrations } from '../migrate';
import { seedDemo } from './seed-demo';

await applyMigrations(db);
await seedDemo(db);
await pool.end();
console.log('compline: migrations applied, demo data present');
