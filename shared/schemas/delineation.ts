/**
 * A subcatchment proposed from the terrain for one outlet (the command line's output, and what
 * the Map desk will show): the contributing area and the longest flow path, in WGS84
 * longitude/latitude, lengths and areas in metres on the WGS84 ellipsoid, with the conditioning
 * the terrain needed so the engineer can judge it.
 */
import { z } from "zod";
import { boundarySchema, lineStringSchema, positionSchema } from "./subcatchments";

const metres = z.number().finite().min(0);

export const conditionedStretchSchema = z.strictObject({
  /** filled: raised by depression filling; flat: routed across level ground; breached: cut. */
  kind: z.enum(["filled", "flat", "breached"]),
  /** Distances from the path's start on the divide, metres. */
  fromM: metres,
  toM: metres,
});

/** What conditioning the whole terrain needed (engine: server/terrain-flow). */
export const conditioningReportSchema = z.strictObject({
  method: z.enum(["fill", "breach"]),
  filledCells: z.number().int().min(0),
  maxFillDepthM: metres,
  flatCells: z.number().int().min(0),
  breachedPits: z.number().int().min(0),
  breachedCells: z.number().int().min(0),
  maxBreachDepthM: metres,
  unbreachedPits: z.number().int().min(0),
});

export const delineationProposalSchema = z.strictObject({
  outlet: z.strictObject({
    requested: positionSchema,
    /** The centre of the cell of largest accumulation within the snap radius. */
    snapped: positionSchema,
    movedM: metres,
  }),
  /** Area of `boundary` on the WGS84 ellipsoid. */
  areaM2: metres,
  /** Area of the cells themselves (the boundary follows them within half a cell). */
  cellsAreaM2: metres,
  longestFlowPathM: metres,
  cells: z.number().int().min(1),
  boundary: boundarySchema,
  /** Whether `boundary` is smoothed (true) or the exact cell edges (small basins). */
  boundarySmoothed: z.boolean(),
  longestFlowPath: lineStringSchema,
  /** Stretches of the longest flow path over conditioned ground, divide first. */
  pathConditioning: z.array(conditionedStretchSchema),
  terrainConditioning: conditioningReportSchema,
});

export const delineationOutputSchema = z.array(delineationProposalSchema);
export type DelineationProposal = z.infer<typeof delineationProposalSchema>;
