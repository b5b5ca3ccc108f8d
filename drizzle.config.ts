import { defineConfig } from 'drizzle-kit';

// Migrations come only from `npm run db:generate`; they are committed and applied at boot.
export default defineConfig({
  dialect: 'sqlite',
  schema: './backend/src/db/schema.ts',
  out: './drizzle',
  casing: 'snake_case',
});
