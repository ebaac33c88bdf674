import { defineConfig } from 'drizzle-kit';

// Migrations are generated from db/schema.ts and applied by the server at start (db/migrate.ts).
export default defineConfig({
  dialect: 'postgresql',
  schema: './db/schema.ts',
  out: './db/migrations',
});
