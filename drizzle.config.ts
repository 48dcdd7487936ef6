import { defineConfig } from "drizzle-kit";

// `npx drizzle-kit generate` writes SQL migrations into drizzle/; the server applies them at boot
// (server/db/migrate.ts). PostGIS owns spatial_ref_sys and its functions: keep them out of diffs.
export default defineConfig({
  dialect: "postgresql",
  schema: [
    "./server/db/schema.ts",
    "./server/db/schema-geodata.ts",
    "./server/db/schema-basemap.ts",
  ],
  out: "./drizzle",
  dbCredentials: { url: process.env.DATABASE_URL ?? "postgres://postgres@127.0.0.1:5432/rillmark" },
  extensionsFilters: ["postgis"],
  tablesFilter: ["!spatial_ref_sys"],
  strict: true,
  verbose: true,
});
