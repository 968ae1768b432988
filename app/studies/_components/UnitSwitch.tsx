"use client";

/**
 * The display-unit switch: energy (MWh / GJ / MMBtu), temperature (°C / K / °F) and gas volume
 * (m³ / ft³). It only changes how figures are shown; the choice is remembered in a cookie and the
 * page is re-rendered.
 */
import { useRouter } from "next/navigation";
import { useTransition } from "react";
import {
  DISPLAY_ENERGY_UNITS,
  DISPLAY_TEMPERATURE_UNITS,
  DISPLAY_VOLUME_UNITS,
  ENERGY_UNIT_LABEL,
  TEMPERATURE_UNIT_LABEL,
  VOLUME_UNIT_LABEL,
  formatDisplayUnits,
  type DisplayUnits,
} from "@/lib/units/display";
import { UNITS_COOKIE } from "./units-cookie";

export function UnitSwitch({
  units,
  groups = ["energy", "temperature", "volume"],
}: {
  units: DisplayUnits;
  groups?: (keyof DisplayUnits)[];
}) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const set = (next: DisplayUnits) => {
    // biome-ignore lint/suspicious/noDocumentCookie: a display preference the server reads; the Cookie Store API is not in every browser yet
    document.cookie = `${UNITS_COOKIE}=${encodeURIComponent(formatDisplayUnits(next))}; path=/; max-age=31536000; samesite=lax`;
    start(() => router.refresh());
  };
  const group = <K extends keyof DisplayUnits>(
    key: K,
    label: string,
    options: readonly DisplayUnits[K][],
    labels: Record<string, string>,
    title?: string,
  ) => (
    <span className="unit-group" role="group" aria-label={label} title={title}>
      <span className="unit-group-label">{label}</span>
      {options.map((o) => (
        <button
          key={o}
          type="button"
          className={`seg${units[key] === o ? " on" : ""}`}
          aria-pressed={units[key] === o}
          onClick={() => units[key] !== o && set({ ...units, [key]: o })}
        >
          {labels[o]}
        </button>
      ))}
    </span>
  );
  return (
    <div className="unit-switch no-print" aria-busy={pending}>
      {groups.includes("energy") && group("energy", "Energy", DISPLAY_ENERGY_UNITS, ENERGY_UNIT_LABEL)}
      {groups.includes("temperature") && group("temperature", "Temperature", DISPLAY_TEMPERATURE_UNITS, TEMPERATURE_UNIT_LABEL)}
      {groups.includes("volume") &&
        group(
          "volume",
          "Volume",
          DISPLAY_VOLUME_UNITS,
          VOLUME_UNIT_LABEL,
          "Cubic feet at the same reference conditions as stated beside each figure (standard cubic feet where the reference is 60 °F, as a plant's metering reference can be set).",
        )}
      {pending && <span className="muted small-note">updating…</span>}
    </div>
  );
}
