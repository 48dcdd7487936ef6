/**
 * Reprojection of a shapefile's coordinates from its .prj (WKT) to WGS84 with proj4. A .prj
 * that proj4 cannot read is refused rather than guessed: a wrong guess puts every feature in
 * the wrong place without a word.
 */
import proj4 from "proj4";
import type { ToWgs84 } from "./normalize";
import { ReadError } from "./types";

export interface SourceCrs {
  readonly name: string;
  /** null when the file is already WGS84 longitude/latitude. */
  readonly toWgs84: ToWgs84 | null;
}

function nameOf(wkt: string): string {
  return /^\s*[A-Z_]+\[\s*"([^"]*)"/.exec(wkt)?.[1] ?? wkt.slice(0, 60);
}

export function crsFromPrj(wkt: string, where: string): SourceCrs {
  let converter: proj4.Converter;
  try {
    converter = proj4(wkt.trim(), "EPSG:4326");
    // proj4's types omit the parsed definition's fields that say what it is.
    const probe = proj4.Proj(wkt.trim()) as unknown as { projName?: string; datumCode?: string };
    const name = nameOf(wkt);
    // Geographic on WGS84 (or a datum proj4 treats as identical to it) needs no transform.
    if (
      probe.projName === "longlat" &&
      (probe.datumCode === "wgs84" || probe.datumCode === undefined)
    ) {
      return { name, toWgs84: null };
    }
    return {
      name,
      toWgs84: (x, y) => {
        const out = converter.forward([x, y]);
        return [out[0] ?? Number.NaN, out[1] ?? Number.NaN];
      },
    };
  } catch {
    throw new ReadError(
      422,
      "bad-prj",
      `${where}: the .prj is not a coordinate system Rillmark can read ("${wkt.trim().slice(0, 80)}"); ` +
        "export the layer again with a standard .prj, or in WGS84",
      where,
    );
  }
}
