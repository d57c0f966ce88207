import { ROLES, type Role } from "@/lib/auth/roles";

/**
 * The authorisation matrix: every page, route handler and server action of the app × the six actors (signed out and
 * the five roles of DESIGN.md) → what must happen. It is written out by hand from DESIGN.md ("Users"), not derived
 * from lib/auth/roles.ts, so the tests that walk it (tests/e2e/authz-matrix.spec.ts against the running app,
 * tests/integration/authz/actions.test.ts for the actions) check the code against the design. A coverage test
 * (tests/unit/authz/matrix.test.ts) fails when a page, route method or exported action has no row.
 *
 * Outcomes:
 * - allowed   — the actor gets the page or the handler's own answer (a 2xx/3xx, or a 4xx about the input only,
 *               which proves the request passed authorisation);
 * - refused   — signed out: a page sends the browser to /login, a route answers 401 JSON, an action says "sign in";
 *               signed in: the 403 page, 403 JSON, or an action's "forbidden" result;
 * - not_found — the 404 page or JSON: the record does not exist or is hidden from this actor.
 *
 * Rows with `{placeholders}` in their sample are filled from the demo seed by the walker (see SAMPLE_PLACEHOLDERS).
 */

/** Who is asking: nobody signed in, or one of the five roles. */
export const ACTORS = ["signedOut", ...ROLES] as const;
export type Actor = "signedOut" | Role;

export type Outcome = "allowed" | "refused" | "not_found";

/** HTTP methods a route handler can export. */
export const ROUTE_METHODS = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"] as const;
export type RouteMethod = (typeof ROUTE_METHODS)[number];

/** A page (`route` as its app/ path without route groups, e.g. "/protocols/[id]"). */
export interface PageRow {
  kind: "page";
  route: string;
  /** The concrete path walked, with `{placeholders}`; defaults to `route`. */
  sample?: string;
  cells: Record<Actor, Outcome>;
  note?: string;
}

/** A route handler method. */
export interface RouteRow {
  kind: "route";
  route: string;
  method: RouteMethod;
  sample?: string;
  cells: Record<Actor, Outcome>;
  note?: string;
}

/** An exported server action (`module` is the file under the repository root, e.g. "lib/users/actions.ts"). */
export interface ActionRow {
  kind: "action";
  module: string;
  name: string;
  cells: Record<Actor, Outcome>;
  note?: string;
}

export type MatrixRow = PageRow | RouteRow | ActionRow;

/** The placeholders a sample may use; the walker resolves each from the seeded demo data. */
export const SAMPLE_PLACEHOLDERS = {
  protocol: "the Larkspur yeast protocol (v1 approved, v2 a draft)",
  approvedVersion: "id of that protocol's approved version 1",
  draftVersion: "id of that protocol's draft version 2",
  population: "id of a seeded population",
  draft: "id of a planner draft belonging to the demo developer",
  fittedPopulation: "id of a population the walker fits from a crossover file (through the fit service), so a version holds a data file",
  fittedVersion: "that population's version holding the data file",
  attachment: "id of a run attachment the walker uploads as the demo technician (POST /api/v1/runs) on an approved version",
} as const;

const LETTERS: Record<string, Outcome> = { A: "allowed", R: "refused", N: "not_found" };

/**
 * One row of cells from six letters in ACTORS order (signed out, developer, reviewer, technician, supervisor, admin):
 * A allowed, R refused, N not found.
 * @example cells("R A A R A R").reviewer // "allowed"
 */
export function cells(letters: string): Record<Actor, Outcome> {
  const parts = letters.trim().split(/\s+/);
  if (parts.length !== ACTORS.length || parts.some((p) => !(p in LETTERS))) {
    throw new Error(`Matrix cells need ${ACTORS.length} letters of A, R, N; got "${letters}".`);
  }
  return Object.fromEntries(ACTORS.map((a, i) => [a, LETTERS[parts[i]]])) as Record<Actor, Outcome>;
}

const page = (route: string, letters: string, sample?: string, note?: string): PageRow => ({ kind: "page", route, cells: cells(letters), sample, note });
const route = (method: RouteMethod, path: string, letters: string, sample?: string, note?: string): RouteRow => ({
  kind: "route",
  route: path,
  method,
  cells: cells(letters),
  sample,
  note,
});
const action = (module: string, name: string, letters: string, note?: string): ActionRow => ({ kind: "action", module, name, cells: cells(letters), note });

const PROTOCOLS = "lib/protocols/actions.ts";
const WIZARD = "lib/wizard/drafts/actions.ts";
const LIBRARY = "lib/library/actions.ts";
const USERS = "lib/users/actions.ts";
const TOKENS = "lib/tokens/actions.ts";

// prettier-ignore
/** Every page, route handler method and server action × actor.                 out dev rev tec sup adm */
export const AUTHZ_MATRIX: readonly MatrixRow[] = [
  // Public pages and the sign-in flow
  page("/",                                                                     "R   A   A   A   A   A", undefined, "redirects to /home"),
  page("/login",                                                                "A   A   A   A   A   A", undefined, "signed in: redirects to /home"),
  page("/login/reset",                                                          "A   A   A   A   A   A"),
  page("/login/password/[token]",                                               "A   A   A   A   A   A", "/login/password/not-a-real-link", "an unknown link shows 'not valid'"),
  // Everyone signed in
  page("/home",                                                                 "R   A   A   A   A   A"),
  page("/settings",                                                             "R   A   A   A   A   A"),
  // Developer: planner and library editing
  page("/planner",                                                              "R   A   R   R   R   R"),
  page("/planner/[draftId]",                                                    "R   A   R   R   R   R", "/planner/{draft}", "redirects to the draft's step"),
  page("/planner/[draftId]",                                                    "R   N   R   R   R   R", "/planner/999999999", "someone else's or no draft"),
  page("/planner/[draftId]/populations",                                        "R   A   R   R   R   R", "/planner/{draft}/populations"),
  page("/planner/[draftId]/buffer",                                             "R   A   R   R   R   R", "/planner/{draft}/buffer"),
  page("/planner/[draftId]/device",                                             "R   A   R   R   R   R", "/planner/{draft}/device"),
  page("/planner/[draftId]/limits",                                             "R   A   R   R   R   R", "/planner/{draft}/limits"),
  page("/planner/[draftId]/results",                                            "R   A   R   R   R   R", "/planner/{draft}/results"),
  page("/planner/[draftId]/save",                                               "R   A   R   R   R   R", "/planner/{draft}/save"),
  page("/library",                                                              "R   A   A   R   A   R", undefined, "redirects to populations"),
  page("/library/[kind]",                                                       "R   A   A   R   A   R", "/library/populations"),
  page("/library/[kind]",                                                       "R   N   N   R   N   R", "/library/no-such-kind"),
  page("/library/[kind]/[id]",                                                  "R   A   A   R   A   R", "/library/populations/{population}"),
  page("/library/[kind]/[id]",                                                  "R   N   N   R   N   R", "/library/populations/999999999"),
  page("/library/[kind]/new",                                                   "R   A   R   R   R   R", "/library/populations/new"),
  page("/library/[kind]/[id]/edit",                                             "R   A   R   R   R   R", "/library/populations/{population}/edit"),
  page("/library/[kind]/[id]/fit",                                              "R   A   R   R   R   R", "/library/populations/{population}/fit"),
  page("/library/[kind]/[id]/characterise",                                     "R   A   R   R   R   R", "/library/populations/{population}/characterise"),
  // Protocols: developers, reviewers and supervisors read them; technicians use the bench list
  page("/protocols",                                                            "R   A   A   R   A   R"),
  page("/protocols/[id]",                                                       "R   A   A   R   A   R", "/protocols/{protocol}"),
  page("/protocols/[id]",                                                       "R   N   N   R   N   R", "/protocols/999999999"),
  page("/protocols/[id]/versions/[n]",                                          "R   A   A   R   A   R", "/protocols/{protocol}/versions/1"),
  page("/protocols/[id]/versions/[n]",                                          "R   N   N   R   N   R", "/protocols/{protocol}/versions/99"),
  page("/protocols/[id]/versions/[n]/diff",                                     "R   A   A   R   A   R", "/protocols/{protocol}/versions/2/diff"),
  // Review (reviewers sign; supervisors read) and bench (technicians record; supervisors read)
  page("/review",                                                               "R   R   A   R   A   R"),
  page("/bench",                                                                "R   R   R   A   A   R"),
  page("/bench/[versionId]",                                                    "R   A   A   A   A   R", "/bench/{approvedVersion}"),
  page("/bench/[versionId]",                                                    "R   A   A   N   A   R", "/bench/{draftVersion}", "technicians never see a draft; readers see its state"),
  // Oversight and administration
  page("/audit",                                                                "R   R   A   R   A   A"),
  page("/mail",                                                                 "R   R   R   R   A   A"),
  page("/admin/users",                                                          "R   R   R   R   R   A"),
  page("/api-docs",                                                             "R   A   A   R   A   R"),

  // Route handlers                                                                    out dev rev tec sup adm
  route("GET",  "/api/auth/[...nextauth]",                                      "A   A   A   A   A   A", "/api/auth/session"),
  route("POST", "/api/auth/[...nextauth]",                                      "A   A   A   A   A   A", "/api/auth/callback/credentials", "no CSRF token: next-auth sends it back to sign-in"),
  route("GET",  "/api/v1/openapi.json",                                         "A   A   A   A   A   A"),
  route("POST", "/api/v1/spectra",                                              "R   A   A   R   A   R"),
  route("POST", "/api/v1/spectra.csv",                                          "R   A   A   R   A   R"),
  route("POST", "/api/v1/sweeps",                                               "R   A   A   R   A   R"),
  route("POST", "/api/v1/windows",                                              "R   A   A   R   A   R"),
  route("POST", "/api/v1/windows/sensitivity",                                  "R   A   A   R   A   R"),
  route("POST", "/api/v1/windows/map.csv",                                      "R   A   A   R   A   R"),
  route("POST", "/api/v1/windows/table.csv",                                    "R   A   A   R   A   R"),
  route("POST", "/api/v1/fits/crossovers",                                      "R   A   A   R   A   R"),
  route("POST", "/api/v1/fits/cells",                                           "R   A   A   R   A   R"),
  route("GET",  "/api/v1/library/[kind]/export",                                "R   A   A   R   A   R", "/api/v1/library/populations/export"),
  route("POST", "/api/v1/library/[kind]/import",                                "R   A   R   R   R   R", "/api/v1/library/populations/import"),
  route("POST", "/api/v1/library/[kind]/[id]/fit",                              "R   A   R   R   R   R", "/api/v1/library/populations/{population}/fit"),
  route("GET",  "/api/v1/library/[kind]/[id]/versions/[version]/data-file",     "R   A   A   R   A   R", "/api/v1/library/populations/{fittedPopulation}/versions/{fittedVersion}/data-file", "the uploaded file, byte for byte"),
  route("GET",  "/api/v1/library/[kind]/[id]/versions/[version]/data-file",     "R   N   N   R   N   R", "/api/v1/library/populations/{population}/versions/1/data-file", "seeded versions hold no data file"),
  route("GET",  "/api/v1/protocols/[id]/versions/[n]/bench-sheet",             "R   A   A   A   A   R", "/api/v1/protocols/{protocol}/versions/1/bench-sheet"),
  route("GET",  "/api/v1/protocols/[id]/versions/[n]/bench-sheet",             "R   A   A   N   A   R", "/api/v1/protocols/{protocol}/versions/2/bench-sheet", "a draft's sheet is hidden from technicians"),
  route("GET",  "/api/v1/protocols/[id]/versions/[n]/exports/[table]",          "R   A   A   R   A   R", "/api/v1/protocols/{protocol}/versions/1/exports/windows"),
  route("POST", "/api/v1/runs",                                                 "R   R   R   A   R   R"),
  route("GET",  "/api/v1/runs/attachments/[attachmentId]",                      "R   A   A   A   A   R", "/api/v1/runs/attachments/{attachment}", "the uploaded file, byte for byte"),
  route("GET",  "/api/v1/runs/attachments/[attachmentId]",                      "R   N   N   N   N   R", "/api/v1/runs/attachments/999999999"),
  route("GET",  "/api/v1/audit.csv",                                            "R   R   A   R   A   A"),

  // Server actions (driven directly with a mocked session)                            out dev rev tec sup adm
  action(PROTOCOLS, "createProtocolAction",                                     "R   A   R   R   R   R"),
  action(PROTOCOLS, "newVersionAction",                                         "R   A   R   R   R   R"),
  action(PROTOCOLS, "saveDraftDetailsAction",                                   "R   A   R   R   R   R"),
  action(PROTOCOLS, "submitVersionAction",                                      "R   A   R   R   R   R"),
  action(PROTOCOLS, "returnVersionAction",                                      "R   R   A   R   R   R"),
  action(PROTOCOLS, "approveVersionAction",                                     "R   R   A   R   R   R"),
  action(PROTOCOLS, "retireVersionAction",                                      "R   R   A   R   R   R"),
  action(WIZARD,    "startDraftAction",                                         "R   A   R   R   R   R"),
  action(WIZARD,    "saveStepAction",                                           "R   A   R   R   R   R"),
  action(WIZARD,    "discardDraftAction",                                       "R   A   R   R   R   R"),
  action(WIZARD,    "saveProtocolAction",                                       "R   A   R   R   R   R"),
  action(LIBRARY,   "saveLibraryItemAction",                                    "R   A   R   R   R   R"),
  action(LIBRARY,   "duplicateItemAction",                                      "R   A   R   R   R   R"),
  action(LIBRARY,   "setArchivedAction",                                        "R   A   R   R   R   R"),
  action("lib/characterisation/actions.ts", "saveCharacterisationAction",       "R   A   R   R   R   R"),
  action(TOKENS,    "createTokenAction",                                        "R   A   A   R   A   R"),
  action(TOKENS,    "revokeTokenAction",                                        "R   A   A   A   A   A", "anyone may revoke their own tokens"),
  action(USERS,     "createUserAction",                                         "R   R   R   R   R   A"),
  action(USERS,     "setRoleAction",                                            "R   R   R   R   R   A"),
  action(USERS,     "setActiveAction",                                          "R   R   R   R   R   A"),
  action(USERS,     "changePasswordAction",                                     "R   A   A   A   A   A"),
  action(USERS,     "completePasswordLinkAction",                               "A   A   A   A   A   A", "the link's token is the credential"),
  action(USERS,     "requestPasswordResetAction",                               "A   A   A   A   A   A", "same answer whether or not the address exists"),
];

/**
 * The rows of one kind.
 * @example rowsOf("page").length // 38
 */
export function rowsOf<K extends MatrixRow["kind"]>(kind: K): Extract<MatrixRow, { kind: K }>[] {
  return AUTHZ_MATRIX.filter((r): r is Extract<MatrixRow, { kind: K }> => r.kind === kind);
}

/**
 * A row's name in test titles and failure messages.
 * @example rowLabel(rowsOf("route")[0]) // "GET /api/auth/session"
 */
export function rowLabel(row: MatrixRow): string {
  if (row.kind === "action") return `${row.module}#${row.name}`;
  const sample = row.sample ?? row.route;
  return row.kind === "route" ? `${row.method} ${sample}` : `page ${sample}`;
}
