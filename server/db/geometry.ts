import { customType } from "drizzle-orm/pg-core";

/**
 * A PostGIS geometry column in EPSG:4326. Drizzle reads and writes it as GeoJSON text through
 * ST_AsGeoJSON / ST_GeomFromGeoJSON in the queries themselves (server/geodata/sql.ts), so the
 * column's TypeScript value is the raw EWKB hex PostgreSQL returns; nothing in the app reads that.
 */
export const geometry = (name: string, type: string) =>
  customType<{ data: string; driverData: string }>({
    dataType: () => `geometry(${type},4326)`,
  })(name);
