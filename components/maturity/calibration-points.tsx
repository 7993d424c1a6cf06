import { formatStrength, type CalibrationPoint, type UnitSystem } from "@/lib/concrete";
import { curingBasisLabel } from "@/lib/ui/vocabulary";
import { Table } from "@/components/ui/table";

/** The calibration's points: which maturity each came from (a set's logger or standard curing) and why not, when a logger fell short. */
export function CalibrationPoints({ points, unit, units }: { points: CalibrationPoint[]; unit: string; units: UnitSystem }) {
  if (points.length === 0) return null;
  return (
    <div className="overflow-x-auto">
      <Table columns={["Age", { label: "Strength", align: "right" }, { label: `Maturity (${unit})`, align: "right" }, "Maturity from"]} testId="calibration-points" compact caption="Calibration points" className="max-w-3xl">
          {points.map((p) => (
            <tr key={`${p.ageDays}:${p.logger ?? ""}:${p.maturity}`} data-testid="calibration-point" data-source={p.logger ? "logger" : "standard"}>
              <td className="whitespace-nowrap px-2 py-1 font-mono">{p.ageDays} d</td>
              <td className="whitespace-nowrap px-2 py-1 text-right font-mono">{formatStrength(p.strengthMPa, units)}{p.breaks > 1 ? ` (${p.breaks})` : ""}</td>
              <td className="px-2 py-1 text-right font-mono">{Math.round(p.maturity).toLocaleString("en-US")}</td>
              <td className="px-2 py-1">
                <span className={p.logger ? "font-semibold text-ink-950" : "text-muted"}>{curingBasisLabel(p.logger)}</span>
                {p.notes.map((n) => (
                  <span key={n} className="block text-xs text-caution-800" data-testid="calibration-point-note">{n}</span>
                ))}
              </td>
            </tr>
          ))}
        </Table>
    </div>
  );
}
