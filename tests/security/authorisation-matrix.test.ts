import { NextRequest } from "next/server";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { getHandle } from "@/db/client";
import { signInAs } from "../helpers/session";
import { expectNoSecrets } from "../api/helpers";
import { actorFor, buildRequest, CALLER_NOTES, CALLERS, ELSEWHERE, loadRoutes, MATRIX, type Handler } from "./matrix";
import { setCurrentRequest } from "./next-auth-flow";
import { startServers } from "./servers";
import { buildWorld, homeIds, restore, snapshot, type World } from "./world";

// The factory imports the helper itself: vi.mock is hoisted above this file's imports.
vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());
process.env.NEXTAUTH_SECRET ??= "test-only-session-key";
process.env.NEXTAUTH_URL ??= "http://localhost:3000";

/**
 * The authorisation matrix: every route handler, every method, called by every role of the home
 * school (with people who are and are not connected to the records), by each role of another
 * school, and signed out. The table in ./matrix.ts says who may; everyone else must be refused with 401
 * (signed out), 403 or 404, and every allowed caller must succeed (2xx) on a fresh copy of the
 * same database. The route list comes from the files: a route or method without a row fails.
 */

// ---- The run -----------------------------------------------------------------------------------

let world: World;
let image: Buffer;
let routes: Map<string, Handler>;
let servers: Awaited<ReturnType<typeof startServers>>;
const tally = { calls: 0, allowed: 0, refused: 0, byStatus: {} as Record<number, number> };

beforeAll(async () => {
  servers = await startServers("matrix");
  world = await buildWorld();
  image = snapshot();
  routes = await loadRoutes();
}, 120_000);

afterAll(async () => {
  await servers?.close();
  const statuses = Object.entries(tally.byStatus)
    .map(([s, n]) => `${s} × ${n}`)
    .join(", ");
  console.log(
    `[authorisation matrix] ${Object.keys(MATRIX).length} route methods × ${CALLERS.length} callers = ${tally.calls} calls: ` +
      `${tally.allowed} allowed and succeeded, ${tally.refused} refused as expected (401/403/404, nothing stored); statuses ${statuses}`,
  );
});

describe("authorisation matrix", () => {
  it("has a row for every route handler file and every method it exports, and no row without a handler", () => {
    const onDisk = [...routes.keys()].sort();
    const inTable = Object.keys(MATRIX).sort();
    expect(onDisk.filter((k) => !MATRIX[k]), "routes with no row in MATRIX: add one saying who may call it").toEqual([]);
    expect(inTable.filter((k) => !routes.has(k)), "rows in MATRIX for routes that do not exist").toEqual([]);
    expect(onDisk.length).toBeGreaterThan(50);
  });

  it("lists only callers it knows", () => {
    for (const [k, e] of Object.entries(MATRIX)) for (const c of e.allow) expect(CALLERS, k).toContain(c);
    expect(Object.keys(CALLER_NOTES)).toEqual([...CALLERS]);
  });

  it.each(Object.keys(MATRIX))("%s", async (key) => {
    const entry = MATRIX[key]!;
    const handler = routes.get(key);
    expect(handler, `${key} has no handler`).toBeTypeOf("function");
    const ids = homeIds(world);
    const wrong: string[] = [];
    for (const caller of CALLERS) {
      restore(image);
      signInAs(actorFor(world, caller));
      const spec = await entry.req(world, caller);
      const { req, params } = spec instanceof NextRequest ? { req: spec, params: { nextauth: req_path_segments(spec) } } : buildRequest(key, spec);
      const before = allRowCounts();
      setCurrentRequest(req);
      const res = await handler!(req, { params: Promise.resolve(params) });
      const text = await res.text();
      tally.calls += 1;
      tally.byStatus[res.status] = (tally.byStatus[res.status] ?? 0) + 1;
      const allowed = entry.allow.includes(caller);
      if (allowed) {
        if (res.status >= 200 && res.status < 300) tally.allowed += 1;
        else wrong.push(`${caller} (${CALLER_NOTES[caller]}) should succeed, got ${res.status}: ${text.slice(0, 200)}`);
        if (ELSEWHERE.includes(caller) && !key.includes("/api/auth/")) {
          const leaked = ids.filter((id) => text.includes(id));
          if (leaked.length) wrong.push(`${caller} got home-school ids in the answer: ${leaked.join(", ")}`);
        }
      } else {
        const expected = caller === "signed-out" ? [401] : entry.idsInBody && ELSEWHERE.includes(caller) ? [400, 403, 404] : [403, 404];
        if (expected.includes(res.status)) tally.refused += 1;
        else wrong.push(`${caller} (${CALLER_NOTES[caller]}) should be refused with ${expected.join(" or ")}, got ${res.status}: ${text.slice(0, 200)}`);
        const after = allRowCounts();
        const changed = Object.keys(after).filter((t) => after[t] !== before[t]);
        if (changed.length) wrong.push(`${caller} was refused but rows changed in: ${changed.join(", ")}`);
        if (res.headers.get("content-type")?.includes("json")) expect(JSON.parse(text).error?.message, `${key} as ${caller}`).toBeTruthy();
      }
      if (!key.startsWith("POST /api/auth/")) expectNoSecrets(text);
    }
    expect(wrong, key).toEqual([]);
  });
});

/** Rows in every table of the current database. */
function allRowCounts(): Record<string, number> {
  const sqlite = getHandle().sqlite;
  const tables = (sqlite.prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' AND name NOT LIKE '__drizzle%'").all() as { name: string }[]).map((t) => t.name);
  return Object.fromEntries(tables.map((t) => [t, (sqlite.prepare(`SELECT count(*) AS n FROM "${t}"`).get() as { n: number }).n]));
}

describe("cross-site requests and server actions", () => {
  const STATE_CHANGING = Object.keys(MATRIX).filter((k) => /^(POST|PUT|PATCH|DELETE) /.test(k) && !k.includes("/api/auth/"));

  it.each(STATE_CHANGING)("%s refuses a request from another site (403), even from an allowed caller, and stores nothing", async (key) => {
    const entry = MATRIX[key]!;
    const caller = entry.allow.find((c) => !c.startsWith("x-")) ?? "signed-out";
    const hostileHeaders: Record<string, string>[] = [{ origin: "https://elsewhere.example" }, { "sec-fetch-site": "cross-site" }, { origin: "null" }];
    for (const headers of hostileHeaders) {
      restore(image);
      signInAs(actorFor(world, caller));
      const spec = await entry.req(world, caller);
      if (spec instanceof NextRequest) throw new Error(key);
      const { req, params } = buildRequest(key, spec);
      const hostile = new NextRequest(req.url, { method: req.method, headers: { ...Object.fromEntries(req.headers), ...headers }, body: spec.body !== undefined ? JSON.stringify(spec.body) : undefined });
      const before = allRowCounts();
      const res = await routes.get(key)!(hostile, { params: Promise.resolve(params) });
      expect(res.status, `${key} ${JSON.stringify(headers)}`).toBe(403);
      expect((await res.json()).error.message).toMatch(/other sites/);
      expect(allRowCounts()).toEqual(before);
    }
  });

  it("next-auth's own sign-in refuses a post without its CSRF token", async () => {
    restore(image);
    const req = new NextRequest("http://localhost:3000/api/auth/callback/credentials", {
      method: "POST",
      headers: { host: "localhost:3000", "content-type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ email: world.people.student.email, password: "correct-horse-lab-notebook", json: "true" }).toString(),
    });
    setCurrentRequest(req);
    const res = await routes.get("POST /api/auth/[...nextauth]")!(req, { params: Promise.resolve({ nextauth: ["callback", "credentials"] }) });
    expect(res.headers.getSetCookie().some((c) => c.includes("session-token"))).toBe(false);
    expect(JSON.parse(await res.text()).url).toMatch(/csrf=true/);
  });

  it("has no server actions (a \"use server\" module would need rows here too)", () => {
    const files = import.meta.glob<string>(["../../app/**/*.{ts,tsx}", "../../components/**/*.{ts,tsx}", "../../lib/**/*.{ts,tsx}"], { query: "?raw", import: "default", eager: true });
    const actions = Object.entries(files)
      .filter(([, text]) => /^\s*["']use server["']/m.test(text))
      .map(([file]) => file);
    expect(actions, "server actions are public endpoints: add each to the matrix before allowing it here").toEqual([]);
  });
});

function req_path_segments(req: NextRequest): string[] {
  return req.nextUrl.pathname.replace(/^\/api\/auth\//, "").split("/");
}
