import { defineConfig } from 'drizzle-kit';

// Migrations are generated from the schema with `npm run db:generate` and committed; the app
// applies them itself at start and in the test setup (drizzle-orm's migrator), so this file
// needs no credentials.
export default defineConfig({
  dialect: 'mysql',
  schema: './server/db/schema.ts',
  out: './drizzle',
});
