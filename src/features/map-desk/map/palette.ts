/**
 * Rillmark's map colours, kept apart from the page palette so the map style reads as one
 * piece: a pale paper ground, ink roads, teal water, and earthy soil groups from light
 * (A, well drained) to dark (D, poorly drained).
 */
export const MAP_COLOURS = {
  ground: "#f2f0e6",
  building: "#d9d3c3",
  buildingEdge: "#b9b09a",
  road: "#ffffff",
  roadCasing: "#a9a294",
  majorRoad: "#f7e7b4",
  stream: "#5a9fc0",
  contour: "#b89f7d",
  contourIndex: "#94785a",
  label: "#3a4b54",
  labelHalo: "#f7f6f1",
  channel: "#1f5f9e",
  boundaryLayer: "#4c5f69",
  subcatchment: "#18252e",
  unmappedCover: "#c9c9c9",
  highlight: "#ff4f8b",
  outlet: "#0e171d",
  measure: "#7a3db8",
} as const;

export const HSG_COLOURS: Record<string, string> = {
  A: "#e3c56b",
  B: "#c08a3e",
  C: "#8c5a3c",
  D: "#5b3a4e",
  "A/D": "#7b5e4a",
  "B/D": "#6e4d4a",
  "C/D": "#64414c",
};

export const REGIME_COLOURS = {
  sheet: "#d98013",
  shallow: "#239492",
  channel: "#1f5f9e",
} as const;

export const REGIME_NAMES = {
  sheet: "Sheet flow",
  shallow: "Shallow concentrated flow",
  channel: "Channel flow",
} as const;
