import { WORK_TEMPLATES } from "@/db/seed/done-lines";

/** One line of a job as the shop would price it (the demo seed's own shape); invented parts, numbers and prices. */
export type LineTemplate = (typeof WORK_TEMPLATES)[string][number];

export interface Job {
  title: string;
  complaint: string;
  cause: string;
  correction: string;
  lines: LineTemplate[];
}

export const SHOP_RATE = 14_250;
export const DIAGNOSIS_RATE = 15_500;

const fromDemo = (title: string, complaint: string, cause: string, correction: string): Job => {
  const lines = WORK_TEMPLATES[title];
  if (!lines) throw new Error(`no demo template "${title}"`);
  return { title, complaint, cause, correction, lines };
};

/** The jobs a heavy-truck shop does over and over; the demo's five plus more of the same kind. */
export const JOBS: Job[] = [
  fromDemo("Preventive maintenance service", "Due for service by engine hours.", "Scheduled interval reached.", "Serviced per the unit's schedule."),
  fromDemo("Annual inspection", "Annual inspection due.", "Inspection interval (12 months).", "Inspected; lamps and lens replaced; report issued."),
  fromDemo("Brake adjustment and chamber replacement", "Long brake stroke found at pre-trip.", "Chambers weak, slack adjusters not adjusting.", "Replaced chambers and slack adjusters; strokes measured and recorded."),
  fromDemo("Hydraulic hose replacement", "Hydraulic oil leaking at the body hoist.", "Hoses chafed through at the frame rail.", "Replaced hoses, re-routed and clamped; circuit bled."),
  {
    title: "Plow and wing hydraulics",
    complaint: "Wing drops slowly with the valve in hold.",
    cause: "Wing cylinder seals bypassing.",
    correction: "Resealed the wing cylinder; checked relief pressure.",
    lines: [
      { kind: "labor", description: "Remove, reseal and refit wing cylinder", quantityMilli: 3_000, unitPriceCents: SHOP_RATE },
      { kind: "part", description: "Cylinder seal kit, 2.5 in bore", partNumber: "SK-25-208", quantityMilli: 1_000, unitPriceCents: 12_480 },
      { kind: "part", description: "Hydraulic oil AW32 (gal)", quantityMilli: 4_000, unitPriceCents: 1_385 },
      { kind: "labor", description: "Check relief valve pressure and adjust", quantityMilli: 500, unitPriceCents: SHOP_RATE },
    ],
  },
  {
    title: "Cooling system repair",
    complaint: "Temperature climbs under load.",
    cause: "Radiator core plugged; water pump seeping.",
    correction: "Cleaned cores, replaced water pump and belt; pressure-tested.",
    lines: [
      { kind: "labor", description: "Pressure-test cooling system; replace water pump and belt", quantityMilli: 4_200, unitPriceCents: SHOP_RATE },
      { kind: "part", description: "Water pump with gasket", partNumber: "WP-4410", quantityMilli: 1_000, unitPriceCents: 38_950, coreChargeCents: 5_000 },
      { kind: "part", description: "Serpentine belt", partNumber: "SB-8PK-2120", quantityMilli: 1_000, unitPriceCents: 7_460 },
      { kind: "part", description: "Coolant, extended life 50/50 (gal)", quantityMilli: 8_000, unitPriceCents: 1_290 },
      { kind: "fee", description: "Coolant disposal", quantityMilli: 1_000, unitPriceCents: 900 },
    ],
  },
  {
    title: "Electrical fault: charging",
    complaint: "Battery lamp on; voltage low at idle.",
    cause: "Alternator output low; corroded main ground.",
    correction: "Replaced alternator, cleaned and sealed grounds; charging tested.",
    lines: [
      { kind: "labor", description: "Test charging system; replace alternator; clean grounds", quantityMilli: 2_400, unitPriceCents: SHOP_RATE },
      { kind: "part", description: "Alternator, 160 A, remanufactured", partNumber: "ALT-160-RM", quantityMilli: 1_000, unitPriceCents: 42_800, coreChargeCents: 8_000 },
      { kind: "part", description: "Battery cable, 2/0, 36 in", partNumber: "BC-20-36", quantityMilli: 2_000, unitPriceCents: 4_650 },
      { kind: "part", description: "Dielectric grease and terminal seal kit", quantityMilli: 1_000, unitPriceCents: 1_840 },
    ],
  },
  {
    title: "Front end and steering",
    complaint: "Truck wanders at highway speed.",
    cause: "Tie-rod ends and drag link worn past limits.",
    correction: "Replaced tie-rod ends and drag link; aligned.",
    lines: [
      { kind: "labor", description: "Replace tie-rod ends and drag link", quantityMilli: 3_600, unitPriceCents: SHOP_RATE },
      { kind: "part", description: "Tie-rod end", partNumber: "TRE-2210", quantityMilli: 2_000, unitPriceCents: 13_875 },
      { kind: "part", description: "Drag link, adjustable", partNumber: "DL-7731", quantityMilli: 1_000, unitPriceCents: 41_290, coreChargeCents: 2_500 },
      { kind: "sublet", description: "Front-end alignment (alignment shop)", quantityMilli: 1_000, unitPriceCents: 18_500 },
    ],
  },
  {
    title: "Air system leaks",
    complaint: "Air gauges drop overnight.",
    cause: "Leaking glad-hand seal and a cracked service line.",
    correction: "Replaced seal and line; leak-down retested.",
    lines: [
      { kind: "labor", description: "Leak-down test, locate and repair leaks", quantityMilli: 1_800, unitPriceCents: SHOP_RATE },
      { kind: "part", description: "Glad-hand seal", quantityMilli: 2_000, unitPriceCents: 495 },
      { kind: "part", description: "Air line, 3/8 in nylon (ft)", quantityMilli: 12_000, unitPriceCents: 185 },
      { kind: "part", description: "Push-to-connect fitting, 3/8 in", partNumber: "PC-38", quantityMilli: 4_000, unitPriceCents: 760 },
    ],
  },
  {
    title: "Tyres and wheel ends",
    complaint: "Steer tyre worn on the outer shoulder.",
    cause: "Tyre at the tread limit; wheel seal weeping.",
    correction: "Mounted two steer tyres; replaced wheel seal.",
    lines: [
      { kind: "labor", description: "Dismount and mount steer tyres; balance", quantityMilli: 1_500, unitPriceCents: SHOP_RATE },
      { kind: "part", description: "Steer tyre, 315/80R22.5", partNumber: "ST-31580", quantityMilli: 2_000, unitPriceCents: 52_400 },
      { kind: "labor", description: "Replace front wheel seal; refill hub", quantityMilli: 1_200, unitPriceCents: SHOP_RATE },
      { kind: "part", description: "Wheel seal, steer axle", partNumber: "WS-22S", quantityMilli: 1_000, unitPriceCents: 6_980 },
      { kind: "fee", description: "Tyre disposal", quantityMilli: 2_000, unitPriceCents: 650 },
    ],
  },
];

/** Small jobs an approver decides one by one (the approvals benchmark's lines); all under $100. */
export const SMALL_LINES: LineTemplate[] = [
  { kind: "part", description: "LED marker lamp, amber, 2 in round", partNumber: "ML-2A", quantityMilli: 1_000, unitPriceCents: 1_860 },
  { kind: "part", description: "Wiper blade, 22 in", partNumber: "WB-22", quantityMilli: 2_000, unitPriceCents: 1_490 },
  { kind: "part", description: "Hose clamp set, T-bolt", quantityMilli: 1_000, unitPriceCents: 2_240 },
  { kind: "part", description: "Grease fitting assortment", quantityMilli: 1_000, unitPriceCents: 1_675 },
  { kind: "part", description: "Mud flap, 24 × 30 in", partNumber: "MF-2430", quantityMilli: 1_000, unitPriceCents: 3_150 },
  { kind: "part", description: "Reflective tape, DOT-C2 (roll)", quantityMilli: 1_000, unitPriceCents: 2_980 },
  { kind: "part", description: "Brake chamber dust boot", partNumber: "DB-30", quantityMilli: 2_000, unitPriceCents: 890 },
  { kind: "part", description: "Hydraulic fitting, JIC -8", partNumber: "JIC-8", quantityMilli: 2_000, unitPriceCents: 1_320 },
  { kind: "part", description: "Fuse and relay assortment", quantityMilli: 1_000, unitPriceCents: 2_450 },
  { kind: "labor", description: "Replace lamp and reseal connector", quantityMilli: 300, unitPriceCents: SHOP_RATE },
  { kind: "labor", description: "Replace and adjust mirror bracket", quantityMilli: 400, unitPriceCents: SHOP_RATE },
  { kind: "labor", description: "Re-secure loose wiring harness", quantityMilli: 200, unitPriceCents: SHOP_RATE },
];

export const FINDING_NOTES = [
  "Measured at the wheel end with the brakes applied at 90–100 psi. **Adjust or replace** before the next run; see the maker's procedure.",
  "Oil film on the cylinder rod and a *wet ring* at the gland. Rod chrome looks sound.\n\n- seal kit on the shelf\n- 2.5 h estimated",
  "Cracked lens and a loose marker lamp on the left side. Water inside the housing.",
  "Belt glazed, tensioner arm at the end of its travel. Replace both together.",
  "Tread at **4/32 in** on the outer shoulder of the left steer tyre; inner edge fine. Check alignment after replacement.",
  "Ground strap corroded through at the frame. Voltage drop 0.6 V cranking.\n\n1. clean\n2. replace the strap\n3. seal with grease",
];
