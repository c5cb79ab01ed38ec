import { accountContacts, accounts, units, users } from "@/db/schema";
import { bulkId } from "./ids";
import { withCheckDigit } from "@/lib/vin";
import type { BulkWriter } from "./bulk";
import type { DemoWorld } from "./demo";
import { Rng, unevenSplit } from "./rng";

/** What the visit generator needs to know about an account. */
export interface AccountInfo {
  id: string;
  name: string;
  kind: Kind;
  township: boolean;
  demo: boolean;
  taxExempt: boolean;
  taxRateMilliPct: number;
  taxExemptCertificate: string | null;
  poRequired: boolean;
  paymentTermsDays: number;
  standingAuthorisationCents: number;
  fiscalYearStartMonth: number;
  shopSuppliesExempt: boolean;
  overrunPercentMilli: number;
  overrunCapCents: number | null;
  overrunFloorCents: number;
  billingEmail: string;
  phone: string;
  address: string;
  contactName: string;
  /** Approvers with their signing limits, lowest first. */
  approvers: { id: string; limitCents: number }[];
  clerkId: string | null;
  poPrefix: string;
}

export interface UnitInfo {
  id: string;
  accountId: string;
  unitNumber: string;
  description: string;
  year: number | null;
  vin: string | null;
  serialNumber: string | null;
  /** Meter at the start of the history, and how fast it climbs. */
  hoursAtStart: number;
  hoursPerDay: number;
  milesAtStart: number;
  milesPerDay: number;
}

export type Kind = "roads" | "schools" | "county" | "aggregates" | "utility";

const KINDS: { kind: Kind; label: string; domain: string; weight: number }[] = [
  { kind: "roads", label: "Township Road Department", domain: "roads", weight: 4 },
  { kind: "schools", label: "School District Transportation", domain: "schools", weight: 3 },
  { kind: "county", label: "County Highway Garage", domain: "county", weight: 2 },
  { kind: "aggregates", label: "Sand & Gravel Co.", domain: "aggregates", weight: 4 },
  { kind: "utility", label: "Rural Water Co-op", domain: "water", weight: 1 },
];

interface UnitType { description: string; prefix: string; body: string | null; road: boolean }

const UNIT_TYPES: Record<Kind, UnitType[]> = {
  roads: [
    { description: "Tandem-axle dump with front plow and wing", prefix: "T-", body: "DT45", road: true },
    { description: "Single-axle dump with salt spreader", prefix: "T-", body: "DS31", road: true },
    { description: "Three-quarter-ton pickup with light bar", prefix: "P-", body: "PK22", road: true },
    { description: "Wheel loader, 3 cu yd bucket", prefix: "L-", body: null, road: false },
    { description: "Motor grader with front blade", prefix: "G-", body: null, road: false },
  ],
  schools: [
    { description: "72-passenger conventional school bus, air brakes", prefix: "Bus ", body: "SB72", road: true },
    { description: "Wheelchair-lift school bus, 48 passengers", prefix: "Bus ", body: "SL48", road: true },
    { description: "14-passenger activity van", prefix: "Van ", body: "AV14", road: true },
  ],
  county: [
    { description: "Tandem-axle dump with underbody scraper", prefix: "C-", body: "DT47", road: true },
    { description: "Tractor with side-boom mower", prefix: "M-", body: null, road: false },
    { description: "Wheel loader, 4 cu yd bucket", prefix: "L-", body: null, road: false },
  ],
  aggregates: [
    { description: "Tri-axle dump, 20 cu yd body", prefix: "Haul ", body: "DX62", road: true },
    { description: "Tractor with end-dump trailer", prefix: "Haul ", body: "TR61", road: true },
    { description: "Water truck, 4,000 gal tank", prefix: "Water ", body: "WT40", road: true },
    { description: "Wheel loader, 5 cu yd rock bucket", prefix: "Loader ", body: null, road: false },
  ],
  utility: [
    { description: "Service truck with crane", prefix: "S-", body: "SV55", road: true },
    { description: "Backhoe loader", prefix: "B-", body: null, road: false },
  ],
};

// 49 CFR 565.15(a): the model-year code in VIN position 10 (2010 = A … 2025 = S).
const YEAR_CODES = "ABCDEFGHJKLMNPRS";
const PLACES_A = ["Alder", "Birch", "Cedar", "Elm", "Fenwick", "Gorse", "Hollis", "Juniper", "Larch", "Marrow", "Nettle", "Osier", "Pell", "Quill", "Rowan", "Sedge", "Tamber", "Umber", "Vetch", "Willow", "Yarrow"];
const PLACES_B = ["Creek", "Hollow", "Ridge", "Falls", "Prairie", "Bend", "Crossing", "Flats", "Hill", "Valley"];
const FIRST = ["Ada", "Bram", "Cora", "Dev", "Edda", "Finn", "Greta", "Hal", "Ines", "Jory", "Kit", "Lena", "Milo", "Nell", "Otto", "Pia", "Rafe", "Sunni", "Tove", "Wren"];
const LAST = ["Ashdown", "Brill", "Corrow", "Dunmore", "Eakin", "Fallow", "Gantry", "Harrow", "Iverley", "Jessop", "Kettering", "Lumley", "Marsh", "Norcott", "Orrin", "Pilcher", "Quarles", "Roper", "Sallow", "Thorne"];

const slug = (text: string) => text.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/(^-|-$)/g, "");

export const HOUR_MS = 3_600_000;
export const DAY_MS = 24 * HOUR_MS;
export const iso = (ms: number) => new Date(ms).toISOString();
export const HISTORY_DAYS = 6 * 365;

/** Adds invented fleet accounts (each with an approver and a clerk) until there are `total`. */
export async function addAccounts(w: BulkWriter, rng: Rng, demo: DemoWorld, total: number, now: number): Promise<AccountInfo[]> {
  const out = [...demo.accounts];
  const places = rng.sample(PLACES_A.flatMap((a) => PLACES_B.map((b) => `${a} ${b}`)), total - out.length);
  const weighted = KINDS.flatMap((k) => Array.from({ length: k.weight }, () => k));
  const createdAt = new Date(now - (HISTORY_DAYS + 60) * DAY_MS).toISOString();
  for (const [i, place] of places.entries()) {
    const k = rng.pick(weighted);
    const publicBody = k.kind !== "aggregates";
    const domain = `${slug(place)}-${k.domain}.example`;
    const name = `${place} ${k.label}`;
    const account: AccountInfo = {
      id: bulkId(),
      name,
      kind: k.kind,
      township: false,
      demo: false,
      taxExempt: publicBody,
      taxRateMilliPct: publicBody ? 0 : rng.pick([6_250, 7_000, 7_500]),
      taxExemptCertificate: publicBody ? `EX-${String(10_000 + i * 37)}` : null,
      poRequired: publicBody && rng.chance(0.6),
      paymentTermsDays: rng.pick([30, 30, 30, 45, 60]),
      standingAuthorisationCents: rng.pick([15_500, 20_000, 25_000, 50_000]),
      fiscalYearStartMonth: k.kind === "schools" ? 7 : k.kind === "county" ? 10 : k.kind === "utility" ? 4 : 1,
      shopSuppliesExempt: false,
      overrunPercentMilli: 10_000,
      overrunCapCents: 5_000,
      overrunFloorCents: 0,
      billingEmail: `clerk@${domain}`,
      phone: `(555) 0${10 + (i % 90)}-${String(1000 + i * 13).slice(-4)}`,
      address: `${10 + i} ${rng.pick(["Depot", "Mill", "Garage", "County"])} Road\n${place}`,
      contactName: `${rng.pick(FIRST)} ${rng.pick(LAST)}`,
      approvers: [],
      clerkId: null,
      poPrefix: `${place.split(" ").map((p) => p[0]).join("")}${k.domain.slice(0, 2).toUpperCase()}`,
    };
    const approverId = bulkId();
    const clerkId = bulkId();
    account.approvers = [{ id: approverId, limitCents: rng.pick([1_000_000, 2_500_000, 5_000_000]) }];
    account.clerkId = clerkId;
    out.push(account);
    await w.add(accounts, {
      id: account.id, name, billingEmail: account.billingEmail, phone: account.phone, address: account.address,
      taxExempt: account.taxExempt, taxExemptCertificate: account.taxExemptCertificate, taxRateMilliPct: account.taxRateMilliPct,
      poRequired: account.poRequired, paymentTermsDays: account.paymentTermsDays, standingAuthorisationCents: account.standingAuthorisationCents,
      // Budgets are set after the history is written, from what it spent (generate.ts).
      repairBudgetCents: null, fiscalYearStartMonth: account.fiscalYearStartMonth, notes: "", createdAt, updatedAt: createdAt,
    });
    await w.add(accountContacts, { id: clerkId, accountId: account.id, name: account.contactName, title: "Clerk", email: account.billingEmail, phone: account.phone, isBilling: true, createdAt });
    for (const [role, id, email, limit] of [["approver", approverId, `approver@${domain}`, account.approvers[0]!.limitCents], ["clerk", clerkId, account.billingEmail, null]] as const) {
      await w.add(users, {
        id, email, name: `${rng.pick(FIRST)} ${rng.pick(LAST)}`, passwordHash: demo.passwordHash, role, accountId: account.id,
        signingLimitCents: limit, phone: "", active: true, lastSignInAt: null, createdAt, updatedAt: createdAt,
      });
    }
  }
  return out;
}

/**
 * Adds units so the township has `townshipUnits` and everyone together
 * `totalUnits`; the other accounts' sizes are uneven, as fleets are.
 */
export async function addUnits(
  w: BulkWriter,
  rng: Rng,
  demo: DemoWorld,
  all: AccountInfo[],
  targets: { totalUnits: number; townshipUnits: number },
  now: number,
): Promise<UnitInfo[]> {
  const out = [...demo.units];
  if (targets.totalUnits <= out.length) return out;
  const existing = (accountId: string) => demo.units.filter((u) => u.accountId === accountId).length;
  const township = all.find((a) => a.township)!;
  const others = all.filter((a) => !a.township);
  const othersTarget = targets.totalUnits - targets.townshipUnits;
  const sizes = unevenSplit(rng, othersTarget, others.length, 3);
  const plan: [AccountInfo, number][] = [[township, targets.townshipUnits - existing(township.id)]];
  others.forEach((a, i) => plan.push([a, Math.max(0, sizes[i]! - existing(a.id))]));
  let serial = 500_000;
  const createdAt = new Date(now - (HISTORY_DAYS + 30) * DAY_MS).toISOString();
  for (const [account, count] of plan) {
    const types = UNIT_TYPES[account.kind];
    for (let i = 0; i < count; i++) {
      const type = rng.pick(types);
      const year = rng.int(2010, 2025);
      const vin = type.body ? withCheckDigit(`0CT${type.body}10${YEAR_CODES[year - 2010]}A${String((serial += 7)).padStart(6, "0")}`) : null;
      const unit: UnitInfo = {
        id: bulkId(),
        accountId: account.id,
        unitNumber: `${type.prefix}${100 + i}`,
        description: type.description,
        year,
        vin,
        serialNumber: vin ? null : `SN-${type.prefix.trim().replace("-", "")}${serial}`,
        hoursAtStart: rng.int(200, 6_000),
        hoursPerDay: 1 + rng.next() * 4,
        milesAtStart: type.road ? rng.int(5_000, 150_000) : 0,
        milesPerDay: type.road ? 20 + rng.next() * 90 : 0,
      };
      out.push(unit);
      const inspected = new Date(now - rng.int(10, 360) * DAY_MS).toISOString().slice(0, 10);
      const due = `${Number(inspected.slice(0, 4)) + 1}${inspected.slice(4)}`.replace("-02-29", "-02-28");
      await w.add(units, {
        id: unit.id, accountId: account.id, unitNumber: unit.unitNumber, vin, serialOnly: !vin, serialNumber: unit.serialNumber,
        year, description: type.description, plate: vin ? `${account.poPrefix}-${1000 + i}` : "",
        // 49 CFR 396.17: periodic inspection at least every 12 months.
        lastInspectionOn: inspected, inspectionDueOn: due, keyOffDrainLimitMa: null, notes: "", createdAt, updatedAt: createdAt,
      });
    }
  }
  return out;
}
