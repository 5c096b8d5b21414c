import { defineConfig } from 'drizzle-kit';

// generating migrations needs no database; `migrate` is done by the app's own start script
export default defineConfig({
  dialect: 'mysql',
  schema: './src/lib/server/db/schema.ts',
  out: './drizzle',
  dbCredentials: { url: process.env.DATABASE_URL ?? 'mysql://wallpulse@127.0.0.1:3307/wallpulse' },
});
