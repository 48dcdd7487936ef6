// Reprojection from a .prj, checked against a published worked example.
import { describe, expect, it } from "vitest";
import { crsFromPrj } from "./reproject";

describe(".prj reprojection", () => {
  it("inverts Snyder's ellipsoidal transverse Mercator example", () => {
    // Snyder, Map Projections — A Working Manual, USGS PP 1395 (1987), TM example on the
    // Clarke 1866 ellipsoid: φ 40°30′N, λ 73°30′W, λ0 75°W, k0 0.9996 → x 127 106.5 m,
    // y 4 484 124.4 m (values from memory). Tolerance 2e-6° (≈ 0.2 m) covers the 0.1 m print.
    const wkt =
      'PROJCS["TM example",GEOGCS["GCS_Clarke_1866",DATUM["D_Clarke_1866",' +
      'SPHEROID["Clarke_1866",6378206.4,294.9786982]],PRIMEM["Greenwich",0.0],' +
      'UNIT["Degree",0.0174532925199433]],PROJECTION["Transverse_Mercator"],' +
      'PARAMETER["False_Easting",0.0],PARAMETER["False_Northing",0.0],' +
      'PARAMETER["Central_Meridian",-75.0],PARAMETER["Scale_Factor",0.9996],' +
      'PARAMETER["Latitude_Of_Origin",0.0],UNIT["Meter",1.0]]';
    const [lon, lat] = crsFromPrj(wkt, "a.zip").toWgs84!(127106.5, 4484124.4);
    expect(Math.abs(lon - -73.5)).toBeLessThan(2e-6);
    expect(Math.abs(lat - 40.5)).toBeLessThan(2e-6);
  });

  it("needs no transform for a WGS84 geographic .prj", () => {
    const wkt =
      'GEOGCS["GCS_WGS_1984",DATUM["D_WGS_1984",SPHEROID["WGS_1984",6378137.0,298.257223563]],' +
      'PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]]';
    expect(crsFromPrj(wkt, "a.zip").toWgs84).toBeNull();
  });
});
