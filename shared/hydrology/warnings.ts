/**
 * Warnings: conditions that are valid but doubtful. They travel with the result, each with a
 * stable code, a plain message, and the segment index or method it concerns, so a sheet can show
 * them beside the number they qualify.
 */
import type { MethodId } from "./method-ids";

export type WarningCode =
  | "slope-low"
  | "sheet-too-long"
  | "sheet-past-cap"
  | "sheet-multi-surface"
  | "sheet-not-upstream"
  | "cn-range"
  | "lag-area-range"
  | "lag-slope-from-path"
  | "lag-cn-from-path"
  | "lag-arc-applied"
  | "kirpich-range"
  | "kerby-length"
  | "faa-length"
  | "min-tc-applied"
  | "idf-extrapolated"
  | "idf-return-period-interpolated"
  | "kinematic-bracketing"
  | "governing-unavailable"
  | "frequency-factor-capped"
  | "frequency-factor-between-rows"
  | "peak-flow-skipped";

export interface HydrologyWarning {
  readonly code: WarningCode;
  readonly message: string;
  readonly segmentIndex?: number;
  readonly method?: MethodId;
}

/** Collects warnings once each (same code, segment, method and message). */
export class WarningList {
  private readonly seen = new Set<string>();
  readonly items: HydrologyWarning[] = [];

  add(warning: HydrologyWarning): void {
    const key = `${warning.code}|${warning.segmentIndex ?? ""}|${warning.method ?? ""}|${warning.message}`;
    if (this.seen.has(key)) return;
    this.seen.add(key);
    this.items.push(warning);
  }
}

/** Slopes under 0.1 % make the traditional Tc formulas unreliable (low-slope studies). */
export const LOW_SLOPE_FT_PER_FT = 0.001;
