/**
 * proj4 definitions for the EPSG codes a terrain GeoTIFF may carry in its GeoKeys. UTM zones
 * are derived from the code (zone = code mod 100; the UTM parameters of NGA.SIG.0012, 2014:
 * central meridian zone × 6 − 183°, scale 0.9996, false easting 500 000 m, false northing
 * 10 000 000 m south of the equator). Datums: WGS84; NAD83 and ETRS89, both GRS80 and within
 * about a metre of WGS84, as proj4 treats them (towgs84 = 0) — well inside a DEM cell.
 */

export interface KnownCrs {
  readonly proj4: string;
  readonly name: string;
  readonly geographic: boolean;
}

function utm(zone: number, south: boolean, datum: "WGS84" | "NAD83" | "ETRS89"): string {
  const ellps = datum === "WGS84" ? "+datum=WGS84" : "+ellps=GRS80 +towgs84=0,0,0,0,0,0,0";
  return `+proj=utm +zone=${zone}${south ? " +south" : ""} ${ellps} +units=m +no_defs`;
}

export function knownCrs(epsg: number): KnownCrs | null {
  const zone = epsg % 100;
  switch (true) {
    case epsg === 4326:
      return { proj4: "+proj=longlat +datum=WGS84 +no_defs", name: "WGS 84", geographic: true };
    case epsg === 4269:
      return {
        proj4: "+proj=longlat +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +no_defs",
        name: "NAD83",
        geographic: true,
      };
    case epsg === 4258:
      return {
        proj4: "+proj=longlat +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +no_defs",
        name: "ETRS89",
        geographic: true,
      };
    case epsg === 3857:
      return {
        proj4:
          "+proj=merc +a=6378137 +b=6378137 +lat_ts=0 +lon_0=0 +x_0=0 +y_0=0 +k=1 +units=m +nadgrids=@null +no_defs",
        name: "WGS 84 / Pseudo-Mercator",
        geographic: false,
      };
    case epsg >= 32601 && epsg <= 32660:
      return {
        proj4: utm(zone, false, "WGS84"),
        name: `WGS 84 / UTM zone ${zone}N`,
        geographic: false,
      };
    case epsg >= 32701 && epsg <= 32760:
      return {
        proj4: utm(zone, true, "WGS84"),
        name: `WGS 84 / UTM zone ${zone}S`,
        geographic: false,
      };
    case epsg >= 26901 && epsg <= 26923:
      return {
        proj4: utm(zone, false, "NAD83"),
        name: `NAD83 / UTM zone ${zone}N`,
        geographic: false,
      };
    case epsg >= 25828 && epsg <= 25838:
      return {
        proj4: utm(zone, false, "ETRS89"),
        name: `ETRS89 / UTM zone ${zone}N`,
        geographic: false,
      };
    default:
      return null;
  }
}
