// Runs once before the suites: brings the throwaway test database (DATABASE_URL, set by
// scripts/test.sh) to the current schema and seeds the Port Ellery demo that API and browser tests
// read. Unit and reference tests need none of it.
export default async function globalSetup() {
  if (!process.env.DATABASE_URL?.includes('compline_test')) {
    console.warn('global-setup: DATABASE_URL is not a test database; API and browser tests will fail. Run them with npm test.');
    return;
  }
  const { db, pool } = await import('../../db/client');
  const { applyMigrations } = await import('../../db/migrate');
  const { seedDemo } = await import('../../db/seed/seed-demo');
  await applyMigrations(db);
  await seedDemo(db);
  await pool.end();
}
