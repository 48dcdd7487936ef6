import { type Layer } from "../../../../shared/schemas/layers";
import { type LayerUploadStep } from "../api/upload-layer";

const STAGES: Record<Layer["progress"]["stage"], string> = {
  received: "Waiting to be read",
  reading: "Reading features",
  saving: "Saving features",
  checking: "Checking geometry",
  done: "Done",
};

function percent(done: number, total: number): number {
  return total > 0 ? Math.min(100, Math.round((done / total) * 100)) : 0;
}

/** What the upload is doing now, as a labelled progress bar. */
export function describeStep(step: LayerUploadStep): { label: string; value: number | null } {
  if (step.step === "sending") {
    const { loadedBytes, totalBytes } = step.progress;
    const mb = (b: number) => (b / 1_048_576).toFixed(1);
    return {
      label: `Sending the file: ${mb(loadedBytes)} of ${mb(totalBytes)} MB`,
      value: percent(loadedBytes, totalBytes),
    };
  }
  const { stage, featuresDone, featuresTotal } = step.layer.progress;
  if (step.layer.status === "ready") return { label: "Layer ready", value: 100 };
  if (step.layer.status === "failed") return { label: "Processing failed", value: null };
  const counts =
    featuresTotal > 0
      ? `: ${featuresDone.toLocaleString()} of ${featuresTotal.toLocaleString()} features`
      : "";
  return {
    label: `${STAGES[stage]}${counts}`,
    value: featuresTotal > 0 ? percent(featuresDone, featuresTotal) : null,
  };
}

export function UploadProgressBar({ step }: { step: LayerUploadStep }) {
  const { label, value } = describeStep(step);
  return (
    <div className="space-y-1">
      <div className="flex justify-between text-xs text-ink-600">
        <span id="layer-upload-progress-label" aria-live="polite">
          {label}
        </span>
        {value !== null && <span className="tabular-nums">{value} %</span>}
      </div>
      {/* A native progress bar: without a value it shows work of unknown length. */}
      <progress
        aria-labelledby="layer-upload-progress-label"
        className="h-2 w-full overflow-hidden rounded-full accent-rill-600"
        max={100}
        {...(value === null ? {} : { value })}
      />
    </div>
  );
}
