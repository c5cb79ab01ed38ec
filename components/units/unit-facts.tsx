import { formatDate } from "@/lib/format";

export interface UnitFactsData {
  unitNumber: string;
  description: string;
  year: number | null;
  vin: string | null;
  serialOnly: boolean;
  serialNumber: string | null;
  plate: string;
  accountName: string;
  inspectionDueOn: string | null;
  inspectionBasis?: "periodic" | "state" | null;
  keyOffDrainLimitMa?: number | null;
}

/** Days from today to the annual inspection (49 CFR 396.17: at least every 12 months). */
function inspectionNote(due: string | null, today: string): { text: string; overdue: boolean } | null {
  if (!due) return null;
  const days = Math.round((Date.parse(`${due}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / 86_400_000);
  if (days < 0) return { text: `overdue by ${-days} day${days === -1 ? "" : "s"}`, overdue: true };
  return { text: `in ${days} day${days === 1 ? "" : "s"}`, overdue: false };
}

export function UnitFacts({ unit, today }: { unit: UnitFactsData; today: string }) {
  const inspection = inspectionNote(unit.inspectionDueOn, today);
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-[0.95rem]">
      <dt className="text-ink-faint">Account</dt>
      <dd>{unit.accountName}</dd>
      <dt className="text-ink-faint">Unit</dt>
      <dd>
        {unit.year ? `${unit.year} ` : ""}
        {unit.description}
      </dd>
      <dt className="text-ink-faint">{unit.serialOnly ? "Serial" : "VIN"}</dt>
      <dd className="figures font-mono break-all">
        {unit.serialOnly ? (
          <>
            {unit.serialNumber ?? "—"} <span className="font-sans text-sm text-ink-faint">(no VIN: serial only)</span>
          </>
        ) : (
          (unit.vin ?? "—")
        )}
      </dd>
      <dt className="text-ink-faint">Plate</dt>
      <dd>{unit.plate || "—"}</dd>
      <dt className="text-ink-faint">Annual inspection</dt>
      <dd className={inspection?.overdue ? "font-bold text-rust-deep" : ""}>
        {unit.inspectionDueOn ? `${formatDate(unit.inspectionDueOn)} (${inspection?.text})` : "—"}
        {unit.inspectionBasis ? <span className="block text-sm text-ink-faint">{unit.inspectionBasis === "state" ? "State program, 49 CFR 396.17(f)" : "Periodic, 49 CFR 396.17(c)"}</span> : null}
      </dd>
      {unit.keyOffDrainLimitMa ? (
        <>
          <dt className="text-ink-faint">Accepted key-off drain</dt>
          <dd className="figures">{unit.keyOffDrainLimitMa} mA</dd>
        </>
      ) : null}
    </dl>
  );
}
