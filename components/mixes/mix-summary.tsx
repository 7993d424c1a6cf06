import { formatLength, formatStrength, formatTemperature, type UnitSystem } from "@/lib/concrete/units";
import { waterRateToDisplay, waterRateUnit } from "@/lib/mixes/units";
import type { MixDesignRow } from "@/lib/mixes/queries";

// Short texts for one mix in the project's units, shared by the list and the read-only detail.
export function mixTexts(mix: MixDesignRow, unitSystem: UnitSystem) {
  const slump =
    mix.slumpTargetMm === null
      ? "—"
      : mix.slumpType === "maximum"
        ? `${formatLength(mix.slumpTargetMm, unitSystem)} max`
        : `${formatLength(mix.slumpTargetMm, unitSystem)}${mix.slumpToleranceMm !== null ? ` ± ${formatLength(mix.slumpToleranceMm, unitSystem)}` : ""}`;
  const water = waterRateToDisplay(mix.siteWaterAllowedLPerM3, unitSystem);
  return {
    strength: `${formatStrength(mix.fcMPa, unitSystem)} at ${mix.fcAgeDays} d`,
    wcm: mix.maxWcm === null ? "—" : mix.maxWcm.toFixed(2),
    slump,
    air: mix.airTargetPct === null ? "Not air-entrained" : `${mix.airTargetPct} %${mix.airTolerancePct !== null ? ` ± ${mix.airTolerancePct}` : ""}`,
    maxTemp: mix.maxConcreteTempC === null ? "Project limit" : formatTemperature(mix.maxConcreteTempC, unitSystem),
    water: water === 0 ? "None" : `${Number(water.toFixed(unitSystem === "SI" ? 1 : 2))} ${waterRateUnit(unitSystem)}`,
    materials: [mix.cementType, mix.scms].filter(Boolean).join("; ") || "—",
    lowBleed: mix.lowBleed ? "Low bleed" : "",
  };
}

export function MixSummary({ mix, unitSystem }: { mix: MixDesignRow; unitSystem: UnitSystem }) {
  const t = mixTexts(mix, unitSystem);
  const rows: [string, string][] = [
    ["Supplier", mix.supplier || "—"],
    ["Specified strength", t.strength],
    ["Maximum w/cm", t.wcm],
    ["Slump", t.slump],
    ["Air content", t.air],
    ["Maximum concrete temperature", t.maxTemp],
    ["Water that may be added at site", t.water],
    ["Materials", t.materials],
    ["Bleed", mix.lowBleed ? "Low bleed: evaporation warnings at half the usual rate" : "Normal"],
  ];
  return (
    <dl className="card grid max-w-3xl grid-cols-[auto_1fr] gap-x-4 gap-y-2 p-4" data-testid="mix-summary">
      {rows.map(([label, value]) => (
        <div key={label} className="contents">
          <dt className="text-muted">{label}</dt>
          <dd className="font-semibold">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
