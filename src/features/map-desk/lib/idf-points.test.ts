import { describe, expect, it } from "vitest";
import { kinematicTravelTimeMin, overlandTerm } from "../../../../shared/hydrology/kinematic-wave";
import { kinematicRelation } from "./idf-points";

describe("the kinematic-wave relation on the rainfall chart", () => {
  it("is the core's tc = K·(nL)^0.6/(i^0.4·S^0.3) through the solution point, at other intensities", () => {
    // K = 0.938 and the overland reach are the core's; the chart only rescales through (tc, i).
    const term = overlandTerm(0.24, 100, 0.02);
    const solved = { intensity: 4.1, tcMin: kinematicTravelTimeMin(0.938, term, 4.1) };
    const [low, high] = kinematicRelation(solved, [2, 6]);
    expect(low!.tcMin).toBeCloseTo(kinematicTravelTimeMin(0.938, term, 2), 10);
    expect(high!.tcMin).toBeCloseTo(kinematicTravelTimeMin(0.938, term, 6), 10);
  });
});
