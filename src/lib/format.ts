import { type UnitSystem } from "../../shared/schemas/projects";

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: "medium" });
const dateTimeFormat = new Intl.DateTimeFormat(undefined, {
  dateStyle: "medium",
  timeStyle: "short",
});

export function formatDate(iso: string): string {
  return dateFormat.format(new Date(iso));
}

export function formatDateTime(iso: string): string {
  return dateTimeFormat.format(new Date(iso));
}

export function returnPeriodLabel(years: number): string {
  return `${years}-year`;
}

export const UNIT_SHORT_LABELS: Record<UnitSystem, string> = {
  us: "US customary",
  si: "SI",
};
