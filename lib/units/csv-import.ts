import { parse } from "csv-parse/sync";
import { unitFields, unitRuleIssues, type UnitFieldsIn } from "@/lib/validation/unit";

/**
 * A fleet's unit list as CSV (RFC 4180, a header row; the columns are the
 * API's unit fields), checked row by row before anything is written. Pure: the
 * caller adds the checks that need the database (numbers and VINs already used).
 */
export const CSV_FIELDS = [
  "unitNumber", "vin", "serialOnly", "serial", "year", "description", "plate",
  "odometer", "engineHours", "lastInspectionOn", "inspectionBasis", "keyOffDrainLimitMa",
] as const satisfies readonly (keyof UnitFieldsIn)[];
export type CsvField = (typeof CSV_FIELDS)[number];

export const MAX_IMPORT_ROWS = 2000;

const key = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, "");
// Headers people commonly write for the same thing (common practice in fleet lists, our choice of which).
const ALIASES: Record<string, CsvField> = {
  ...Object.fromEntries(CSV_FIELDS.map((f) => [key(f), f])),
  unit: "unitNumber", unitno: "unitNumber", number: "unitNumber", fleetnumber: "unitNumber",
  serialnumber: "serial", novin: "serialOnly", serialonly: "serialOnly",
  hours: "engineHours", enginehrs: "engineHours", miles: "odometer", mileage: "odometer",
  lastinspection: "lastInspectionOn", inspected: "lastInspectionOn", basis: "inspectionBasis",
  keyoffdrainma: "keyOffDrainLimitMa", drainlimitma: "keyOffDrainLimitMa", drainma: "keyOffDrainLimitMa",
  licenseplate: "plate", licenceplate: "plate",
};

export interface CsvProblem {
  /** The line in the file (the header is line 1). */
  row: number;
  field: string;
  message: string;
}

export interface CsvRow {
  row: number;
  unitNumber: string;
  vin: string;
  description: string;
  problems: CsvProblem[];
}

export interface ParsedUnit extends UnitFieldsIn {
  row: number;
  /** The VIN as stored (upper case, no separators), or null for a serial-only unit. */
  normalizedVin: string | null;
}

export interface CsvCheck {
  rows: CsvRow[];
  /** Problems of the file as a whole (row 1: the header; row 0: the file). */
  fileProblems: CsvProblem[];
  ignoredColumns: string[];
  units: ParsedUnit[];
}

export function checkUnitCsv(text: string, today: string): CsvCheck {
  let records: string[][];
  try {
    records = parse(text, { skip_empty_lines: true, trim: true, bom: true, relax_column_count: true }) as string[][];
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    return { rows: [], fileProblems: [{ row: 0, field: "file", message: `The file is not CSV Cotter can read: ${message}` }], ignoredColumns: [], units: [] };
  }
  const [header, ...body] = records;
  if (!header) return { rows: [], fileProblems: [{ row: 0, field: "file", message: "The file is empty." }], ignoredColumns: [], units: [] };

  const columns = header.map((h) => ALIASES[key(h)] ?? null);
  const ignoredColumns = header.filter((_, i) => columns[i] === null);
  const fileProblems: CsvProblem[] = [];
  for (const needed of ["unitNumber", "description"] as const) {
    if (!columns.includes(needed)) fileProblems.push({ row: 1, field: needed, message: `The header has no “${needed}” column.` });
  }
  const seen = new Set<CsvField>();
  columns.forEach((c, i) => {
    if (c && seen.has(c)) fileProblems.push({ row: 1, field: c, message: `Two columns (the second is “${header[i]}”) both say ${c}.` });
    if (c) seen.add(c);
  });
  if (body.length === 0) fileProblems.push({ row: 0, field: "file", message: "The file has a header but no units." });
  if (body.length > MAX_IMPORT_ROWS) fileProblems.push({ row: 0, field: "file", message: `At most ${MAX_IMPORT_ROWS} units per file; this one has ${body.length}. Split it.` });
  if (fileProblems.length) return { rows: [], fileProblems, ignoredColumns, units: [] };

  const rows: CsvRow[] = [];
  const units: ParsedUnit[] = [];
  const numbers = new Map<string, number>();
  const vins = new Map<string, number>();
  body.forEach((cells, i) => {
    const line = i + 2;
    const raw: Record<string, string> = {};
    columns.forEach((c, j) => {
      if (c) raw[c] = cells[j] ?? "";
    });
    const problems: CsvProblem[] = [];
    if (cells.length !== header.length) problems.push({ row: line, field: "row", message: `This row has ${cells.length} cells; the header has ${header.length}.` });
    const parsed = unitFields.safeParse(raw);
    let normalizedVin: string | null = null;
    if (!parsed.success) {
      for (const issue of parsed.error.issues) problems.push({ row: line, field: String(issue.path[0] ?? "row"), message: issue.message });
    } else {
      const rules = unitRuleIssues(parsed.data, today);
      normalizedVin = rules.vin;
      for (const issue of rules.issues) problems.push({ row: line, field: issue.path, message: issue.message });
    }
    const number = (raw.unitNumber ?? "").trim();
    const firstNumber = numbers.get(number.toUpperCase());
    if (number && firstNumber) problems.push({ row: line, field: "unitNumber", message: `Unit number ${number} is also on line ${firstNumber}.` });
    else if (number) numbers.set(number.toUpperCase(), line);
    if (normalizedVin) {
      const firstVin = vins.get(normalizedVin);
      if (firstVin) problems.push({ row: line, field: "vin", message: `This VIN is also on line ${firstVin}.` });
      else vins.set(normalizedVin, line);
    }
    rows.push({ row: line, unitNumber: number, vin: raw.vin ?? "", description: raw.description ?? "", problems });
    if (parsed.success && problems.length === 0) units.push({ ...parsed.data, row: line, normalizedVin });
  });
  return { rows, fileProblems, ignoredColumns, units };
}

export function allProblems(check: CsvCheck): CsvProblem[] {
  return [...check.fileProblems, ...check.rows.flatMap((r) => r.problems)];
}
