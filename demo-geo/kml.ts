/**
 * A small KML 2.2 writer (OGC 07-147r2) for the demo subcatchment: one Document of Placemarks,
 * each with a name, a description and one Point, LineString or Polygon in lon,lat.
 */
export type KmlGeometry =
  | { readonly type: "Point"; readonly coordinates: readonly [number, number] }
  | { readonly type: "LineString"; readonly coordinates: readonly (readonly [number, number])[] }
  | { readonly type: "Polygon"; readonly outer: readonly (readonly [number, number])[] };

export interface KmlPlacemark {
  readonly name: string;
  readonly description: string;
  /** Simple extended data (KML 2.2 section 9.3), written as <Data name="..."><value>. */
  readonly data?: Readonly<Record<string, string>>;
  readonly geometry: KmlGeometry;
}

function escape(text: string): string {
  return text
    .replaceAll("&", "&amp;")
    .replaceAll("<", "&lt;")
    .replaceAll(">", "&gt;")
    .replaceAll('"', "&quot;");
}

const coords = (points: readonly (readonly [number, number])[]) =>
  points.map(([lon, lat]) => `${lon},${lat}`).join(" ");

function geometryXml(g: KmlGeometry): string {
  switch (g.type) {
    case "Point":
      return `<Point><coordinates>${coords([g.coordinates])}</coordinates></Point>`;
    case "LineString":
      return `<LineString><tessellate>1</tessellate><coordinates>${coords(g.coordinates)}</coordinates></LineString>`;
    case "Polygon":
      return (
        "<Polygon><outerBoundaryIs><LinearRing><coordinates>" +
        coords(g.outer) +
        "</coordinates></LinearRing></outerBoundaryIs></Polygon>"
      );
  }
}

function placemarkXml(p: KmlPlacemark): string {
  const data = Object.entries(p.data ?? {})
    .map(([k, v]) => `<Data name="${escape(k)}"><value>${escape(v)}</value></Data>`)
    .join("");
  return [
    "    <Placemark>",
    `      <name>${escape(p.name)}</name>`,
    `      <description>${escape(p.description)}</description>`,
    ...(data === "" ? [] : [`      <ExtendedData>${data}</ExtendedData>`]),
    `      ${geometryXml(p.geometry)}`,
    "    </Placemark>",
  ].join("\n");
}

export function kmlDocument(name: string, description: string, marks: KmlPlacemark[]): string {
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    '<kml xmlns="http://www.opengis.net/kml/2.2">',
    "  <Document>",
    `    <name>${escape(name)}</name>`,
    `    <description>${escape(description)}</description>`,
    ...marks.map(placemarkXml),
    "  </Document>",
    "</kml>",
    "",
  ].join("\n");
}
