import geodesic from "geographiclib-geodesic";
import { describe, expect, it } from "vitest";
import type { LonLat } from "../../../../shared/geo";
import type { LayerFeatures } from "../api/get-layer-features";
import { coverIndex, featureBox, liveSegments, soilIndex } from "./live-split";

const WGS84 = geodesic.Geodesic.WGS84;
/** GeographicLib's inverse problem on WGS84 (geographiclib-geodesic 2.2.0), the reference. */
const gDist = (a: LonLat, b: LonLat) => WGS84.Inverse(a[1], a[0], b[1], b[0]).s12 as number;

const square = (west: number, east: number) => ({
  type: "Polygon" as const,
  coordinates: [
    [
      [west, 45],
      [east, 45],
      [east, 45.01],
      [west, 45.01],
      [west, 45],
    ],
  ],
});

const cover: LayerFeatures = {
  truncated: false,
  features: [
    { id: 1, geometry: square(7, 7.01), surfaceClassId: "woods", hsg: null },
    { id: 2, geometry: square(7.01, 7.02), surfaceClassId: "lawn", hsg: null },
  ],
};
const soil: LayerFeatures = {
  truncated: false,
  features: [{ id: 3, geometry: square(7, 7.02), surfaceClassId: null, hsg: "B" }],
};

describe("the live split in the browser", () => {
  it("cuts a path crossing two cover polygons where it crosses, lengths as GeographicLib gives them (1 mm)", () => {
    const path: LonLat[] = [
      [7.005, 45.005],
      [7.015, 45.005],
    ];
    const segments = liveSegments(path, coverIndex([cover]), soilIndex([soil]), {
      sheetEndM: null,
      channelStartM: null,
    });
    expect(segments.map((s) => s.surfaceClassId)).toEqual(["woods", "lawn"]);
    expect(segments.every((s) => s.hsg === "B" && s.regime === "shallow")).toBe(true);
    // The path (a straight line in lon/lat, as the split cuts it) meets the shared edge at 7.01°.
    expect(segments[0]!.lengthM).toBeCloseTo(gDist(path[0]!, [7.01, 45.005]), 3);
    expect(segments[0]!.lengthM + segments[1]!.lengthM).toBeCloseTo(gDist(path[0]!, path[1]!), 3);
  });

  it("starts with sheet flow up to the sheet break", () => {
    const path: LonLat[] = [
      [7.005, 45.005],
      [7.015, 45.005],
    ];
    const segments = liveSegments(path, coverIndex([cover]), soilIndex([soil]), {
      sheetEndM: 30,
      channelStartM: null,
    });
    expect(segments[0]).toMatchObject({ regime: "sheet", stationFromM: 0, stationToM: 30 });
    expect(segments[1]).toMatchObject({ regime: "shallow", stationFromM: 30 });
  });

  it("gives a stretch the engineer overrode its class, as the server's compute does", () => {
    const path: LonLat[] = [
      [7.005, 45.005],
      [7.015, 45.005],
    ];
    const segments = liveSegments(
      path,
      coverIndex([cover]),
      soilIndex([soil]),
      { sheetEndM: null, channelStartM: null },
      [{ stationFromM: 100, stationToM: 200, surfaceClassId: "gravel" }],
    );
    expect(segments.map((s) => s.surfaceClassId)).toEqual(["woods", "gravel", "woods", "lawn"]);
    expect(segments[1]).toMatchObject({ stationFromM: 100, stationToM: 200, hsg: "B" });
    // The cover layer's own cut stays where GeographicLib puts the crossing of 7.01° (1 mm).
    expect(segments[3]!.stationFromM).toBeCloseTo(gDist(path[0]!, [7.01, 45.005]), 3);
  });

  it("asks for features in a box snapped outward to 0.005°, so small edits reuse it", () => {
    expect(
      featureBox([
        [7.0012, 45.0031],
        [7.0061, 45.0049],
      ]),
    ).toEqual([7, 45, 7.01, 45.005]);
    expect(featureBox([])).toBeNull();
  });
});
