/**
 * .prj text (ESRI-flavoured WKT 1, the dialect GIS packages put in shapefiles) for the EPSG
 * codes Rillmark writes: WGS84 / NAD83 / ETRS89 geographic, and their UTM zones, built from the
 * zone number (central meridian = zone × 6 − 183°, scale 0.9996, false easting 500 000 m, false
 * northing 10 000 000 m in the south; the UTM definition of NGA.SIG.0012, 2014).
 */
interface Datum {
  readonly gcs: string;
  readonly datum: string;
  readonly spheroid: string;
  readonly a: number;
  readonly invF: number;
}

const WGS84: Datum = {
  gcs: "GCS_WGS_1984",
  datum: "D_WGS_1984",
  spheroid: "WGS_1984",
  a: 6378137,
  invF: 298.257223563,
};
const NAD83: Datum = {
  gcs: "GCS_North_American_1983",
  datum: "D_North_American_1983",
  spheroid: "GRS_1980",
  a: 6378137,
  invF: 298.257222101,
};
const ETRS89: Datum = {
  gcs: "GCS_ETRS_1989",
  datum: "D_ETRS_1989",
  spheroid: "GRS_1980",
  a: 6378137,
  invF: 298.257222101,
};

function geogcs(d: Datum): string {
  return (
    `GEOGCS["${d.gcs}",DATUM["${d.datum}",SPHEROID["${d.spheroid}",${d.a}.0,${d.invF}]],` +
    `PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]]`
  );
}

function utm(d: Datum, name: string, zone: number, south: boolean): string {
  return (
    `PROJCS["${name}",${geogcs(d)},PROJECTION["Transverse_Mercator"],` +
    `PARAMETER["False_Easting",500000.0],PARAMETER["False_Northing",${south ? "10000000.0" : "0.0"}],` +
    `PARAMETER["Central_Meridian",${zone * 6 - 183}.0],PARAMETER["Scale_Factor",0.9996],` +
    `PARAMETER["Latitude_Of_Origin",0.0],UNIT["Meter",1.0]]`
  );
}

/** The .prj WKT for an EPSG code, or null when this module does not know the code. */
export function prjForEpsg(epsg: number): string | null {
  if (epsg === 4326) return geogcs(WGS84);
  if (epsg === 4269) return geogcs(NAD83);
  if (epsg === 4258) return geogcs(ETRS89);
  const zone = epsg % 100;
  if (epsg >= 32601 && epsg <= 32660) return utm(WGS84, `WGS_1984_UTM_Zone_${zone}N`, zone, false);
  if (epsg >= 32701 && epsg <= 32760) return utm(WGS84, `WGS_1984_UTM_Zone_${zone}S`, zone, true);
  if (epsg >= 26901 && epsg <= 26923) return utm(NAD83, `NAD_1983_UTM_Zone_${zone}N`, zone, false);
  if (epsg >= 25828 && epsg <= 25838)
    return utm(ETRS89, `ETRS_1989_UTM_Zone_${zone}N`, zone, false);
  return null;
}
