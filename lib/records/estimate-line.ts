import type { Decision, LineKind, LineState } from "../estimate";
import { lineAmountCents } from "../money";

/** The stored fields of an estimate line the API and the pages show. */
export interface LineFields {
  id: string;
  kind: LineKind;
  description: string;
  quantityMilli: number;
  unitPriceCents: number;
  taxable: boolean;
  coreChargeCents: number;
  coreReturnedAt: string | null;
  state: LineState;
  version: number;
  findingId: string | null;
  concernId: string | null;
  partNumber: string;
  isDiagnosis: boolean;
  byStanding: boolean;
  reopenReason: string | null;
  deferredFromLineId: string | null;
  extendsLineId: string | null;
}

/** The latest decision on a line as the API shows it (api-v1.md, plus the version it was made on). */
export interface DecisionOut {
  by: string;
  at: string;
  decision: Decision;
  amountCents: number;
  note: string;
  lineVersion: number;
}

/** A decision just written (its record from lib/estimate), as the API shows it. */
export function decisionOut(by: string, at: string, record: { decision: Decision; amountCents: number; note: string | null; lineVersion: number }): DecisionOut {
  return { by, at, decision: record.decision, amountCents: record.amountCents, note: record.note ?? "", lineVersion: record.lineVersion };
}

/** Who decided, in words: a person's name, or the standing authorisation. */
export function decidedBy(d: { byStanding: boolean; by: string | null }): string {
  return d.byStanding ? "Standing authorisation" : (d.by ?? "Unknown");
}

/**
 * An estimate line on the way out, the one shape of it: api-v1.md's `lines[]`
 * (`amountCents` is quantity × unit price, the core charge apart) and the
 * additive fields the pages use. A list of lines without their decisions (a
 * unit's deferred lines) uses the fields alone.
 */
export function lineFieldsOut(l: LineFields) {
  return {
    id: l.id,
    kind: l.kind,
    description: l.description,
    quantity: l.quantityMilli / 1000,
    unitPriceCents: l.unitPriceCents,
    amountCents: lineAmountCents(l.quantityMilli, l.unitPriceCents),
    taxable: l.taxable,
    coreChargeCents: l.coreChargeCents,
    // What the core costs if it does not come back (shown even once it has).
    coreTotalCents: lineAmountCents(l.quantityMilli, l.coreChargeCents),
    coreReturnedAt: l.coreReturnedAt,
    state: l.state,
    version: l.version,
    findingId: l.findingId,
    concernId: l.concernId,
    partNumber: l.partNumber,
    isDiagnosis: l.isDiagnosis,
    byStanding: l.byStanding,
    reopenReason: l.reopenReason,
    deferredFromLineId: l.deferredFromLineId,
    extendsLineId: l.extendsLineId,
  };
}

export function lineOut(l: LineFields, decision: DecisionOut | null) {
  return { ...lineFieldsOut(l), decision };
}

export type LineOut = ReturnType<typeof lineOut>;
