// Every page of the app, as the role that uses it, at the sizes that role uses it. The
// accessibility sweep (tests/browser/accessibility.test.ts) visits each one; a unit test
// (tests/unit/a11y-pages.test.ts) fails when a page under app/ has no entry here, so a new page
// gets swept once it is added.
//
// To add a page: add one entry with
//   route     — the page's path as the app/ tree spells it, route groups dropped: "/units/[id]"
//   as        — the demo person who uses it (their role decides what the page shows)
//   viewports — "phone" (390×844) for technicians, approvers and fleet people, "desktop" for the
//               shop's desk pages; both where both are used
//   ids       — for each [param], a SQL query against the demo database whose first row's
//               first column is a real id; the sweep fills the path with it

export type Viewport = "phone" | "desktop";

export interface PageEntry {
  route: string;
  as: string;
  viewports: readonly Viewport[];
  ids?: Readonly<Record<string, string>>;
  /** Where the page is expected to end up (a redirect), when not at its own path. */
  landsOn?: RegExp;
  /**
   * A page whose real state the demo database cannot show (the one-time set-up page needs an
   * empty database; invitation and reset pages need a live e-mailed link): the named browser
   * test opens it in that state and runs the same axe check there.
   */
  sweptIn?: string;
}

const WRITER = "writer@quarry-road.example";
const OWNER = "owner@quarry-road.example";
const TECH = "tech@quarry-road.example";
const SUPERVISOR = "supervisor@brennan-twp.example";
const CLERK = "clerk@brennan-twp.example";
const FOREMAN = "foreman@brennan-twp.example";

const township = "(SELECT id FROM accounts WHERE name LIKE 'Brennan Township%')";

export const PAGES: readonly PageEntry[] = [
  { route: "/", as: WRITER, viewports: ["desktop"], landsOn: /\/floor$/ },
  { route: "/sign-in", as: "", viewports: ["phone", "desktop"] },
  { route: "/forgot-password", as: "", viewports: ["phone"] },
  { route: "/setup", as: "", viewports: ["desktop"], sweptIn: "first-week.test.ts" },
  { route: "/invitation/[token]", as: "", viewports: ["phone", "desktop"], sweptIn: "first-week.test.ts" },
  { route: "/reset-password/[token]", as: "", viewports: ["phone"], sweptIn: "first-week.test.ts" },

  // The shop.
  { route: "/floor", as: TECH, viewports: ["phone", "desktop"] },
  { route: "/work-orders/[id]", as: WRITER, viewports: ["desktop"], ids: { id: "SELECT id FROM work_orders WHERE number = 1042" } },
  { route: "/work-orders/[id]", as: TECH, viewports: ["phone"], ids: { id: "SELECT id FROM work_orders WHERE number = 1043" } },
  { route: "/work-orders/[id]/findings/new", as: TECH, viewports: ["phone"], ids: { id: "SELECT id FROM work_orders WHERE number = 1043" } },
  { route: "/units/[id]", as: WRITER, viewports: ["desktop"], ids: { id: "SELECT id FROM units WHERE unit_number = 'T-9'" } },
  { route: "/units/[id]/edit", as: WRITER, viewports: ["desktop"], ids: { id: "SELECT id FROM units WHERE unit_number = 'T-9'" } },
  { route: "/units", as: WRITER, viewports: ["desktop"] },
  { route: "/units/new", as: WRITER, viewports: ["desktop"] },
  { route: "/work-orders", as: WRITER, viewports: ["desktop"] },
  { route: "/work-orders/new", as: WRITER, viewports: ["desktop"] },
  { route: "/me", as: TECH, viewports: ["phone"] },
  { route: "/me", as: WRITER, viewports: ["desktop"] },
  { route: "/concerns/[id]", as: TECH, viewports: ["phone", "desktop"], ids: { id: "SELECT id FROM concerns WHERE intermittent = 1 ORDER BY created_at LIMIT 1" } },
  { route: "/accounts", as: WRITER, viewports: ["desktop"] },
  { route: "/accounts/[id]", as: WRITER, viewports: ["desktop"], ids: { id: `SELECT id FROM accounts WHERE id = ${township}` } },
  { route: "/accounts/[id]/import", as: WRITER, viewports: ["desktop"], ids: { id: `SELECT id FROM accounts WHERE id = ${township}` } },
  { route: "/accounts/new", as: WRITER, viewports: ["desktop"] },
  { route: "/invoices", as: WRITER, viewports: ["desktop"] },
  { route: "/invoices/[id]", as: WRITER, viewports: ["desktop"], ids: { id: "SELECT id FROM invoices WHERE status <> 'void' ORDER BY issued_at DESC LIMIT 1" } },
  { route: "/receivables", as: WRITER, viewports: ["desktop"] },
  { route: "/receivables/[accountId]", as: WRITER, viewports: ["desktop"], ids: { accountId: `SELECT id FROM accounts WHERE id = ${township}` } },
  { route: "/settings", as: OWNER, viewports: ["desktop"] },
  { route: "/settings/people", as: OWNER, viewports: ["desktop"] },
  { route: "/settings/tokens", as: WRITER, viewports: ["desktop"] },
  { route: "/settings/tokens/reference", as: WRITER, viewports: ["desktop"] },
  { route: "/settings/mail", as: OWNER, viewports: ["desktop"] },

  // The fleet.
  { route: "/fleet", as: SUPERVISOR, viewports: ["phone", "desktop"] },
  { route: "/fleet/work-orders/[id]", as: SUPERVISOR, viewports: ["phone", "desktop"], ids: { id: "SELECT id FROM work_orders WHERE number = 1042" } },
  { route: "/fleet/units/[id]", as: FOREMAN, viewports: ["phone"], ids: { id: "SELECT id FROM units WHERE unit_number = 'T-9'" } },
  { route: "/fleet/units/[id]/log", as: FOREMAN, viewports: ["phone"], ids: { id: "SELECT id FROM units WHERE unit_number = 'T-9'" } },
  { route: "/fleet/occurrences", as: FOREMAN, viewports: ["phone"] },
  { route: "/fleet/units", as: FOREMAN, viewports: ["phone", "desktop"] },
  { route: "/fleet/reports", as: FOREMAN, viewports: ["phone"] },
  { route: "/fleet/reports/new", as: FOREMAN, viewports: ["phone"] },
  { route: "/fleet/me", as: SUPERVISOR, viewports: ["phone"] },
  { route: "/fleet/invoices", as: CLERK, viewports: ["phone", "desktop"] },
  { route: "/fleet/invoices/[id]", as: CLERK, viewports: ["phone", "desktop"], ids: { id: `SELECT id FROM invoices WHERE account_id = ${township} AND status <> 'void' ORDER BY issued_at DESC LIMIT 1` } },
  { route: "/fleet/statement", as: CLERK, viewports: ["phone", "desktop"] },
  { route: "/fleet/settings/tokens", as: CLERK, viewports: ["desktop"] },
  // A fleet's IT person reads the reference at a desk; people also look it up on a phone.
  { route: "/fleet/settings/tokens/reference", as: CLERK, viewports: ["phone", "desktop"] },
];
