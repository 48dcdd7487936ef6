import { useState, type FormEvent } from "react";
import { LAYER_KINDS, uploadLayerFields, type LayerKind } from "../../../../shared/schemas/layers";
import { Button } from "../../../components/Button";
import { FormError, Notice } from "../../../components/FormError";
import { Select } from "../../../components/Select";
import { TextField } from "../../../components/TextField";
import { isApiError } from "../../../lib/api";
import { fieldErrorsOf, type FieldErrors } from "../../../lib/form";
import { useUploadLayer, type LayerUploadStep } from "../api/upload-layer";
import { UploadProgressBar } from "./UploadProgressBar";

export const KIND_LABELS: Record<LayerKind, string> = {
  cover: "Land cover",
  soil: "Soils",
  terrain: "Terrain (DEM)",
  channel: "Channels and streams",
  boundary: "Boundaries",
};

const KIND_OPTIONS = LAYER_KINDS.map((k) => ({ value: k, label: KIND_LABELS[k] }));
const ACCEPT: Record<LayerKind, string> = {
  terrain: ".tif,.tiff",
  cover: ".zip,.kml,.kmz,.gpx,.geojson,.json",
  soil: ".zip,.kml,.kmz,.gpx,.geojson,.json",
  channel: ".zip,.kml,.kmz,.gpx,.geojson,.json",
  boundary: ".zip,.kml,.kmz,.gpx,.geojson,.json",
};

function errorText(error: unknown): string | null {
  if (!error) return null;
  if (isApiError(error)) {
    const where = error.fields.where;
    return where && !error.message.includes(where) ? `${error.message} (${where})` : error.message;
  }
  return error instanceof Error ? error.message : "The upload failed. Try again.";
}

/** Kind, name and file; the bar follows the bytes going up, then the server reading them. */
export function UploadLayerForm({ projectId }: { projectId: string }) {
  const upload = useUploadLayer(projectId);
  const [kind, setKind] = useState<LayerKind>("cover");
  const [step, setStep] = useState<LayerUploadStep | null>(null);
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const serverFields = isApiError(upload.error) ? upload.error.fields : {};
  const errors = { ...serverFields, ...clientErrors };

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const target = event.currentTarget;
    const data = new FormData(target);
    const file = data.get("file");
    const parsed = uploadLayerFields.safeParse({
      kind: data.get("kind"),
      name: (data.get("name") as string | null) || undefined,
      verticalUnit: kind === "terrain" ? data.get("verticalUnit") : undefined,
    });
    const found: FieldErrors = parsed.success ? {} : fieldErrorsOf(parsed.error);
    if (!(file instanceof File) || file.size === 0) found.file = "Choose a file to upload.";
    setClientErrors(found);
    if (!parsed.success || !(file instanceof File) || found.file) return upload.reset();
    setStep(null);
    upload.mutate(
      { fields: parsed.data, file, onStep: setStep },
      { onSuccess: () => target.reset() },
    );
  }

  return (
    <form noValidate onSubmit={onSubmit} className="space-y-4" aria-label="Upload a layer">
      <Select
        label="Kind of layer"
        name="kind"
        options={KIND_OPTIONS}
        value={kind}
        onChange={(e) => setKind(e.target.value as LayerKind)}
        error={errors.kind}
      />
      <TextField
        label="Layer name"
        name="name"
        optional
        autoComplete="off"
        hint="Left empty, the file's name is used."
        error={errors.name}
      />
      {kind === "terrain" && (
        <Select
          label="Elevation unit in the file"
          name="verticalUnit"
          options={[
            { value: "m", label: "Metres" },
            { value: "ft", label: "Feet" },
          ]}
          error={errors.verticalUnit}
        />
      )}
      <TextField
        label="File"
        name="file"
        type="file"
        accept={ACCEPT[kind]}
        hint={
          kind === "terrain"
            ? "A GeoTIFF with its coordinate system and nodata value."
            : "A zipped shapefile (with .prj), KML, KMZ, GPX or GeoJSON."
        }
        error={errors.file}
      />
      {step && (upload.isPending || upload.isSuccess) && <UploadProgressBar step={step} />}
      <FormError message={errorText(upload.error)} />
      {upload.isSuccess && (
        <Notice>
          “{upload.data.name}” is ready
          {upload.data.kind === "terrain"
            ? "."
            : `: ${upload.data.featureCount.toLocaleString()} features.`}
        </Notice>
      )}
      <Button type="submit" pending={upload.isPending} className="w-full">
        Upload layer
      </Button>
    </form>
  );
}
