import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative, sep } from "node:path";
import { describe, expect, it } from "vitest";
import { ACTORS, AUTHZ_MATRIX, cells, ROUTE_METHODS, rowsOf, SAMPLE_PLACEHOLDERS } from "@/lib/authz/matrix";

/**
 * The matrix lists every page (app/**\/page.tsx), every route handler method (app/**\/route.ts) and every exported
 * server action (files starting with 'use server'), found by walking the source tree: a new page, method or action
 * without a row fails here.
 */

const ROOT = process.cwd();

function walk(dir: string, out: string[] = []): string[] {
  for (const name of readdirSync(dir)) {
    if (name === "node_modules" || name.startsWith(".")) continue;
    const path = join(dir, name);
    if (statSync(path).isDirectory()) walk(path, out);
    else out.push(relative(ROOT, path).split(sep).join("/"));
  }
  return out;
}

/** "app/(app)/protocols/[id]/page.tsx" → "/protocols/[id]" (route groups dropped). */
function routeOf(file: string): string {
  const parts = file.split("/").slice(1, -1).filter((p) => !/^\(.*\)$/.test(p));
  return "/" + parts.join("/");
}

/** The HTTP methods a route.ts exports (`export const GET`, `export async function POST`, `export { h as GET }`). */
function exportedMethods(source: string): string[] {
  const found = new Set<string>();
  const names = ROUTE_METHODS.join("|");
  for (const m of source.matchAll(new RegExp(`export\\s+(?:const|let|(?:async\\s+)?function)\\s+(${names})\\b`, "g"))) found.add(m[1]);
  for (const m of source.matchAll(/export\s*\{([^}]*)\}/g)) {
    for (const spec of m[1].split(",")) {
      const name = spec.trim().split(/\s+as\s+/).pop()!.trim();
      if ((ROUTE_METHODS as readonly string[]).includes(name)) found.add(name);
    }
  }
  return [...found].sort();
}

/** Exported functions of a 'use server' module. */
function exportedActions(source: string): string[] {
  return [...source.matchAll(/export\s+(?:async\s+)?(?:function\s+|const\s+)([A-Za-z0-9_]+)/g)].map((m) => m[1]).sort();
}

const files = [...walk(join(ROOT, "app")), ...walk(join(ROOT, "lib")), ...walk(join(ROOT, "components"))];
const sorted = (xs: string[]) => [...new Set(xs)].sort();

describe("authorisation matrix covers the whole app", () => {
  it("has a row for every page, and no row for a page that does not exist", () => {
    const pages = files.filter((f) => /^app\/.*\/?page\.tsx$/.test(f)).map(routeOf);
    expect(pages.length).toBeGreaterThan(20);
    expect(sorted(rowsOf("page").map((r) => r.route))).toEqual(sorted(pages));
  });

  it("has a row for every exported method of every route handler, and no other", () => {
    const methods = files
      .filter((f) => /^app\/.*route\.ts$/.test(f))
      .flatMap((f) => {
        const found = exportedMethods(readFileSync(join(ROOT, f), "utf8"));
        expect(found, `${f} exports no HTTP method the walker recognises`).not.toEqual([]);
        return found.map((m) => `${m} ${routeOf(f)}`);
      });
    expect(methods.length).toBeGreaterThan(15);
    expect(sorted(rowsOf("route").map((r) => `${r.method} ${r.route}`))).toEqual(sorted(methods));
  });

  it("has a row for every exported server action, and no other", () => {
    const actions = files
      .filter((f) => /\.(ts|tsx)$/.test(f) && /^\s*["']use server["'];?/.test(readFileSync(join(ROOT, f), "utf8")))
      .flatMap((f) => exportedActions(readFileSync(join(ROOT, f), "utf8")).map((name) => `${f}#${name}`));
    expect(actions.length).toBeGreaterThan(15);
    expect(sorted(rowsOf("action").map((r) => `${r.module}#${r.name}`))).toEqual(sorted(actions));
  });

  it("gives every row a cell for each of the six actors, and only known placeholders in samples", () => {
    expect(ACTORS).toEqual(["signedOut", "developer", "reviewer", "technician", "supervisor", "admin"]);
    for (const row of AUTHZ_MATRIX) {
      expect(Object.keys(row.cells).sort()).toEqual([...ACTORS].sort());
      if (row.kind === "action") continue;
      for (const [, name] of (row.sample ?? "").matchAll(/\{(\w+)\}/g)) expect(Object.keys(SAMPLE_PLACEHOLDERS)).toContain(name);
    }
    const samples = AUTHZ_MATRIX.filter((r) => r.kind !== "action").map((r) => (r.kind === "route" ? r.method : "page") + " " + (r.sample ?? r.route));
    expect(sorted(samples)).toHaveLength(samples.length); // no probe listed twice
  });

  it("reads cell letters strictly", () => {
    expect(cells("R A A R A N")).toEqual({ signedOut: "refused", developer: "allowed", reviewer: "allowed", technician: "refused", supervisor: "allowed", admin: "not_found" });
    expect(() => cells("A A A")).toThrow(/6 letters/);
    expect(() => cells("A A A A A X")).toThrow(/6 letters/);
  });

  it("keeps DESIGN.md's separation of duties: only reviewers sign, only technicians record runs, admins neither author nor sign", () => {
    const allowedTo = (name: string) =>
      ACTORS.filter((a) => rowsOf("action").find((r) => r.name === name)!.cells[a] === "allowed");
    expect(allowedTo("approveVersionAction")).toEqual(["reviewer"]);
    expect(allowedTo("createProtocolAction")).toEqual(["developer"]);
    expect(rowsOf("route").find((r) => r.route === "/api/v1/runs")!.cells).toEqual(cells("R R R A R R"));
    for (const page of ["/review", "/bench"]) expect(rowsOf("page").find((r) => r.route === page)!.cells.supervisor).toBe("allowed");
  });
});
