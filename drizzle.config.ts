import { defineConfig } from 'drizzle-kit'

export default defineConfig({
  dialect: 'postgresql',
  schema: './server/database/schema.ts',
  out: './drizzle',
  dbCredentials: { url: process.env.NUXT_DATABASE_URL ?? 'postgres://tonewright@127.0.0.1:54329/tonewright' },
  strict: true,
})
