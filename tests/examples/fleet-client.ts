// A fleet's own script, as its IT person would write it: the types come from
// `npx openapi-typescript <cotter>/api/v1/openapi.json -o fleet-api.d.ts`, the
// calls go through openapi-fetch with a personal API token. It lists the
// account's units in the shop, reads the lines of the first work order waiting
// for approval and approves the smallest pending one.
//
//   COTTER_URL=https://cotter.example COTTER_TOKEN=ctr_… npx tsx tests/examples/fleet-client.ts
//
// tests/browser/fleet-client.test.ts runs it against the app.
import createClient from "openapi-fetch";
import type { components, paths } from "./fleet-api";

type Line = components["schemas"]["EstimateLine"];
type Problem = components["schemas"]["Problem"];

export interface FleetRun {
  unitsInShop: { unitNumber: string; status: string | null; workOrderId: string | null }[];
  workOrder: { id: string; label: string; lines: Pick<Line, "id" | "description" | "state" | "amountCents">[] } | null;
  approved: { line: Line; grandTotalCents: number } | null;
}

/** The error a refused call answers with, as a sentence. */
function refused(what: string, problem: Problem | undefined, status: number): Error {
  return new Error(`${what}: ${status} ${problem ? `${problem.code}: ${problem.detail}` : "(no problem document)"}`);
}

export async function runFleetExample(baseUrl: string, token: string, log: (line: string) => void = console.log): Promise<FleetRun> {
  const api = createClient<paths>({ baseUrl, headers: { authorization: `Bearer ${token}` } });

  // 1. The account's units in the shop (the API answers only the token owner's account).
  const units = await api.GET("/api/v1/units", { params: { query: { inShop: "true" } } });
  if (!units.data) throw refused("listing units", units.error, units.response.status);
  const unitsInShop = units.data.units.map((u) => ({ unitNumber: u.unitNumber, status: u.status, workOrderId: u.workOrderId }));
  for (const u of unitsInShop) log(`${u.unitNumber}: ${u.status ?? "not in the shop"}`);

  // 2. The lines of the first work order waiting for a decision.
  const waiting = units.data.units.find((u) => u.status === "waiting_approval" && u.workOrderId);
  if (!waiting?.workOrderId) return { unitsInShop, workOrder: null, approved: null };
  const wo = await api.GET("/api/v1/work-orders/{id}", { params: { path: { id: waiting.workOrderId } } });
  if (!wo.data) throw refused(`reading work order ${waiting.workOrderId}`, wo.error, wo.response.status);
  const lines = wo.data.lines.map((l) => ({ id: l.id, description: l.description, state: l.state, amountCents: l.amountCents }));
  log(`${wo.data.label} ${wo.data.title}: ${lines.length} lines`);
  const workOrder = { id: wo.data.id, label: wo.data.label, lines };

  // 3. Approve the smallest line still waiting, on the version we read (a 409 stale_version if it changed since).
  const pending = wo.data.lines.filter((l) => l.state === "proposed").sort((a, b) => a.amountCents - b.amountCents)[0];
  if (!pending) return { unitsInShop, workOrder, approved: null };
  const decided = await api.POST("/api/v1/lines/{id}/decision", {
    params: { path: { id: pending.id } },
    body: { decision: "approve", expectedVersion: pending.version, note: "Approved from our maintenance system." },
  });
  if (!decided.data) throw refused(`approving ${pending.description}`, decided.error, decided.response.status);
  log(`approved ${decided.data.line.description}: ${(decided.data.line.amountCents / 100).toFixed(2)}; approved so far ${(decided.data.totals.grandTotalCents / 100).toFixed(2)}`);
  return { unitsInShop, workOrder, approved: { line: decided.data.line, grandTotalCents: decided.data.totals.grandTotalCents } };
}

if (process.argv[1] && import.meta.filename === process.argv[1]) {
  const { COTTER_URL, COTTER_TOKEN } = process.env;
  if (!COTTER_URL || !COTTER_TOKEN) {
    console.error("Set COTTER_URL (the app's address) and COTTER_TOKEN (a personal API token, from API tokens in the app).");
    process.exit(2);
  }
  await runFleetExample(COTTER_URL, COTTER_TOKEN);
}
