import { defineConfig } from 'drizzle-kit';

// `npm run db:generate` writes SQL migrations into drizzle/ from server/db/schema.ts (no database needed).
// They are applied at start-up and in tests by server/db/migrate.ts.
export default defineConfig({
  dialect: 'postgresql',
  schema: './server/db/schema.ts',
  out: './drizzle',
  dbCredentials: { url: process.env.DATABASE_URL ?? 'postgres://localhost/kilowatch' },
  strict: true,
});
