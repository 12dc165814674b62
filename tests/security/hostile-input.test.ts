import { getTableConfig, type SQLiteTable } from "drizzle-orm/sqlite-core";
import fc from "fast-check";
import { JSDOM } from "jsdom";
import { NextRequest } from "next/server";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { RichTextView } from "@/components/editor/rich-text-view";
import { LinkedText } from "@/components/admin/linked-text";
import { getHandle } from "@/db/client";
import * as schema from "@/db/schema";
import type { RichTextDoc } from "@/lib/validation/rich-text";
import { signInAs } from "../helpers/session";
import { actorFor, loadRoutes, MATRIX, type Caller, type Handler, type Spec } from "./matrix";
import { setCurrentRequest } from "./next-auth-flow";
import { startServers } from "./servers";
import { buildWorld, restore, snapshot, type World } from "./world";

vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());
process.env.NEXTAUTH_SECRET ??= "test-only-session-key";

/**
 * Hostile input against every state-changing route handler, as a caller who is allowed to use it
 * (so the input, not the permission check, is what is tested): malformed JSON, oversized bodies,
 * wrong content types, wrong types in every field, script payloads in every text field and in
 * rich text, path traversal in file names and ids, SQL-looking strings, and the numbers JSON
 * should never carry (NaN, Infinity, 1e309, -0 …). Each input must be refused with a clear 4xx
 * and store nothing, or — where the field is free text — be stored verbatim and render inert.
 * Never a 5xx. The counts are printed at the end (README, "Reliability").
 */

// ---- The inputs --------------------------------------------------------------------------------

const XSS = [
  "<script>alert(1)</script>",
  '"><img src=x onerror=alert(1)>',
  "javascript:alert(1)",
  "<svg/onload=alert(1)>",
  "<a href=\"javascript:alert(1)\">click</a>",
  "</textarea><script>alert(1)</script>",
  "{{constructor.constructor('alert(1)')()}}",
  "<iframe srcdoc='<script>alert(1)</script>'></iframe>",
];
const SQL = ["' OR '1'='1", "'; DROP TABLE users; --", '" OR ""="', "1; SELECT * FROM users", "%' --", "admin'/*"];
const TRAVERSAL = ["../../../../etc/passwd", "..\\..\\..\\windows\\win.ini", "/etc/passwd", "..%2F..%2F..%2Fetc%2Fpasswd", "photo.jpg\u0000.html", "a/../../b.jpg", "CON", "....//....//etc/passwd"];
/** Written into the JSON text as they are: JSON.parse turns 1e309 into Infinity and keeps -0; NaN is not JSON at all. */
const NUMBERS: [string, string][] = [
  ["NaN", "NaN"],
  ["Infinity", "Infinity"],
  ["-Infinity", "-Infinity"],
  ["1e309", "1e309"],
  ["-1e309", "-1e309"],
  ["-0", "-0"],
  ["1e-400", "1e-400"],
  ["2^53 + 1", "9007199254740993"],
  ["-1", "-1"],
  ["0.5", "0.5"],
];
const WRONG_TYPES: unknown[] = [null, true, 0, -1, "", "x", [], {}, [null], { $gt: "" }];
const MALFORMED = [
  "",
  "{",
  '{"a":',
  "[",
  "null",
  '"just a string"',
  "123",
  "true",
  "{'single': 'quotes'}",
  '{"a":1} trailing',
  "{,}",
  "\u0000",
  "\uFEFF{}",
  '{"a":"\\ud800"}',
  "[".repeat(100_000),
];
const PATH_IDS = ["../../etc/passwd", "..%2F..%2Fetc%2Fpasswd", "' OR '1'='1", "1; DROP TABLE users; --", "<script>alert(1)</script>", "%00", "a".repeat(5000), "null", "undefined", "-1", "1e309", "NaN", "__proto__", "constructor"];

type Kind = "malformed JSON" | "oversized body" | "wrong content type" | "wrong type" | "missing field" | "script payload" | "rich-text payload" | "SQL-looking string" | "path traversal" | "special number" | "hostile id in the address" | "hostile query string" | "prototype pollution" | "property-based";
type Tally = { tried: number; refused: number; storedVerbatim: number; acceptedUnchanged: number };
const tally = new Map<Kind, Tally>();
const count = (kind: Kind, outcome: keyof Omit<Tally, "tried">) => {
  const t = tally.get(kind) ?? { tried: 0, refused: 0, storedVerbatim: 0, acceptedUnchanged: 0 };
  t.tried += 1;
  t[outcome] += 1;
  tally.set(kind, t);
};

// ---- Running one input -------------------------------------------------------------------------

let world: World;
let image: Buffer;
let routes: Map<string, Handler>;
let servers: Awaited<ReturnType<typeof startServers>>;

const STATE_CHANGING = Object.keys(MATRIX).filter((k) => /^(POST|PUT|PATCH|DELETE) /.test(k) && !k.includes("/api/auth/"));

/** The caller a route is tested as: the first of its allowed callers in the home school. */
function callerFor(key: string): Caller {
  return MATRIX[key]!.allow.find((c) => !c.startsWith("x-")) ?? "signed-out";
}

async function validSpec(key: string): Promise<Spec> {
  const spec = await MATRIX[key]!.req(world, callerFor(key));
  if (spec instanceof NextRequest) throw new Error(`${key}: no plain spec`);
  return spec;
}

function tableNames(): string[] {
  return (getHandle().sqlite.prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' AND name NOT LIKE '__drizzle%'").all() as { name: string }[]).map((t) => t.name);
}
function rowCounts(): Record<string, number> {
  const sqlite = getHandle().sqlite;
  return Object.fromEntries(tableNames().map((t) => [t, (sqlite.prepare(`SELECT count(*) AS n FROM "${t}"`).get() as { n: number }).n]));
}
function textColumns(): [string, string][] {
  const sqlite = getHandle().sqlite;
  return tableNames().flatMap((t) => (sqlite.prepare(`PRAGMA table_info("${t}")`).all() as { name: string; type: string }[]).filter((c) => /TEXT/i.test(c.type)).map((c) => [t, c.name] as [string, string]));
}
/** Whether the exact string is stored anywhere (as it is, or as it appears inside stored JSON). */
function storedSomewhere(value: string): boolean {
  const sqlite = getHandle().sqlite;
  const forms = [value, JSON.stringify(value).slice(1, -1)];
  return textColumns().some(([t, c]) => forms.some((f) => (sqlite.prepare(`SELECT 1 FROM "${t}" WHERE instr("${c}", ?) > 0 LIMIT 1`).get(f) as unknown) !== undefined));
}
/** "table.column" of every column Drizzle keeps as JSON. */
const JSON_COLUMNS = new Set(
  (Object.values(schema) as unknown[])
    .filter((v): v is SQLiteTable => !!v && typeof v === "object" && Symbol.for("drizzle:IsDrizzleTable") in v)
    .flatMap((t) => {
      const c = getTableConfig(t);
      return c.columns.filter((col) => col.dataType === "json").map((col) => `${c.name}.${col.name}`);
    }),
);

/** Junk that must never be stored: non-finite numbers, non-integers in integer columns, JSON columns that do not parse. */
function junk(): string[] {
  const sqlite = getHandle().sqlite;
  const out: string[] = [];
  for (const t of tableNames()) {
    for (const c of sqlite.prepare(`PRAGMA table_info("${t}")`).all() as { name: string; type: string }[]) {
      const inf = sqlite.prepare(`SELECT count(*) AS n FROM "${t}" WHERE typeof("${c.name}") = 'real' AND abs("${c.name}") > 1.7976931348623157e308`).get() as { n: number };
      if (inf.n) out.push(`${t}.${c.name} holds Infinity`);
      if (/INTEGER/i.test(c.type)) {
        const wrong = sqlite.prepare(`SELECT count(*) AS n FROM "${t}" WHERE typeof("${c.name}") NOT IN ('integer', 'null')`).get() as { n: number };
        if (wrong.n) out.push(`${t}.${c.name} holds a non-integer`);
      }
      if (JSON_COLUMNS.has(`${t}.${c.name}`)) {
        const bad = sqlite.prepare(`SELECT count(*) AS n FROM "${t}" WHERE "${c.name}" IS NOT NULL AND NOT json_valid("${c.name}")`).get() as { n: number };
        if (bad.n) out.push(`${t}.${c.name} holds broken JSON`);
      }
    }
  }
  return out;
}

type Sent = { status: number; text: string; changed: string[] };

async function send(key: string, spec: Spec, raw?: { body: string; headers?: Record<string, string> }, caller = callerFor(key)): Promise<Sent> {
  restore(image);
  signInAs(actorFor(world, caller));
  const [method, template] = key.split(" ") as [string, string];
  const params: Record<string, string> = {};
  const url = template.replace(/\[(\w+)\]/g, (_, name: string) => {
    params[name] = spec.params?.[name] ?? "";
    return encodeURIComponent(params[name]!);
  });
  const headers: Record<string, string> = { host: "localhost:3000", origin: "http://localhost:3000", "content-type": "application/json", ...raw?.headers };
  const body = raw ? raw.body : spec.body !== undefined ? JSON.stringify(spec.body) : undefined;
  const req = new NextRequest(`http://localhost:3000${url}${spec.query ? `?${spec.query}` : ""}`, { method, headers, body: method === "GET" ? undefined : body });
  const before = rowCounts();
  setCurrentRequest(req);
  const res = await routes.get(key)!(req, { params: Promise.resolve(params) });
  const text = await res.text();
  const after = rowCounts();
  return { status: res.status, text, changed: Object.keys(after).filter((t) => after[t] !== before[t]) };
}

/** Checks one answer; returns a problem, or null. Counts it under `kind`. */
function judge(kind: Kind, label: string, r: Sent, opts: { payload?: string; persisted?: boolean; storedAs?: (p: string) => string } = {}): string | null {
  if (r.status >= 500) return `${label}: ${r.status} ${r.text.slice(0, 200)}`;
  if (r.status >= 400) {
    let message: unknown;
    try {
      message = JSON.parse(r.text).error?.message;
    } catch {
      message = undefined;
    }
    if (typeof message !== "string" || !message) return `${label}: ${r.status} without a clear message: ${r.text.slice(0, 120)}`;
    if (r.changed.length) return `${label}: refused (${r.status}) but rows changed in ${r.changed.join(", ")}`;
    count(kind, "refused");
    return null;
  }
  if (r.status < 200 || r.status >= 300) return `${label}: unexpected ${r.status}`;
  const j = junk();
  if (j.length) return `${label}: accepted and stored junk: ${j.join("; ")}`;
  if (opts.payload !== undefined && opts.persisted) {
    const expected = opts.storedAs ? opts.storedAs(opts.payload) : opts.payload;
    if (!storedSomewhere(expected)) return `${label}: accepted but not stored ${opts.storedAs ? "in its safe form" : "verbatim"}`;
    count(kind, "storedVerbatim");
    return null;
  }
  count(kind, "acceptedUnchanged");
  return null;
}

// ---- The body's fields -------------------------------------------------------------------------

type Path = (string | number)[];
function leaves(value: unknown, path: Path = []): { path: Path; value: unknown }[] {
  if (Array.isArray(value)) return value.flatMap((v, i) => leaves(v, [...path, i]));
  if (value && typeof value === "object") return Object.entries(value).flatMap(([k, v]) => leaves(v, [...path, k]));
  return [{ path, value }];
}
function withValue(body: unknown, path: Path, value: unknown): unknown {
  if (!path.length) return value;
  const [head, ...rest] = path;
  if (Array.isArray(body)) return body.map((v, i) => (i === head ? withValue(v, rest, value) : v));
  return { ...(body as object), [head!]: withValue((body as Record<string, unknown>)[head as string], rest, value) };
}
function without(body: unknown, path: Path): unknown {
  const [head, ...rest] = path;
  if (!rest.length) {
    if (Array.isArray(body)) return body.filter((_, i) => i !== head);
    const copy = { ...(body as Record<string, unknown>) };
    delete copy[head as string];
    return copy;
  }
  if (Array.isArray(body)) return body.map((v, i) => (i === head ? without(v, rest) : v));
  return { ...(body as object), [head!]: without((body as Record<string, unknown>)[head as string], rest) };
}
/** JSON text with the value at `path` written as a raw literal (for NaN, 1e309, -0 …). */
function withRawNumber(body: unknown, path: Path, literal: string): string {
  const marker = "__RAW_NUMBER_MARKER__";
  return JSON.stringify(withValue(body, path, marker)).replace(`"${marker}"`, literal);
}
const label = (key: string, path: Path) => `${key} ${path.length ? path.join(".") : "(body)"}`;

/**
 * Fields that are deliberately stored in a safe form rather than as sent: a photo's original
 * file name keeps no path separators (it never reaches a storage key either).
 */
const SAFE_FORMS: Record<string, (p: string) => string> = { filename: (p) => p.replace(/[\\/]/g, "_") };

// ---- Setup and report --------------------------------------------------------------------------

beforeAll(async () => {
  servers = await startServers("hostile");
  world = await buildWorld();
  image = snapshot();
  routes = await loadRoutes();
}, 120_000);

afterAll(async () => {
  await servers?.close();
  const rows = [...tally.entries()].sort((a, b) => b[1].tried - a[1].tried);
  const total = rows.reduce((a, [, t]) => a + t.tried, 0);
  const refused = rows.reduce((a, [, t]) => a + t.refused, 0);
  const verbatim = rows.reduce((a, [, t]) => a + t.storedVerbatim, 0);
  const lines = rows.map(([k, t]) => `  ${k.padEnd(26)} ${String(t.tried).padStart(6)} tried: ${t.refused} refused with a 4xx, ${t.storedVerbatim} stored verbatim as free text, ${t.acceptedUnchanged} accepted as valid`);
  console.log(`[hostile input] ${total} inputs to ${STATE_CHANGING.length} state-changing route handlers (and the GET handlers' ids and query strings): ${refused} refused with a clear 4xx and nothing stored, ${verbatim} stored verbatim and rendered inert, 0 answered 5xx\n${lines.join("\n")}`);
});

// ---- The suites --------------------------------------------------------------------------------

describe("hostile input", () => {
  it("covers every state-changing route handler", () => {
    expect(STATE_CHANGING.length).toBeGreaterThan(45);
    for (const key of STATE_CHANGING) expect(routes.get(key), key).toBeTypeOf("function");
  });

  it.each(STATE_CHANGING)("%s: malformed, oversized and mistyped bodies are refused with a clear 4xx and store nothing", async (key) => {
    const spec = await validSpec(key);
    const problems: string[] = [];
    // The valid request itself succeeds (so refusals below are about the input).
    const ok = await send(key, spec);
    expect(ok.status, `${key} valid request: ${ok.text.slice(0, 200)}`).toBeLessThan(300);
    if (spec.body === undefined) return; // The handler reads no body: only its address is input (below).

    for (const body of MALFORMED) problems.push(judge("malformed JSON", `${key} body ${JSON.stringify(body.slice(0, 20))}`, await send(key, spec, { body })) ?? "");
    const valid = JSON.stringify(spec.body);
    const padded = (n: number) => `{"padding":"${"x".repeat(n)}",${valid.slice(1)}`;
    problems.push(judge("oversized body", `${key} 1.2 MB`, await send(key, spec, { body: padded(1_200_000) })) ?? "");
    problems.push(judge("oversized body", `${key} 1.2 MB with a small declared length`, await send(key, spec, { body: padded(1_200_000), headers: { "content-length": "20" } })) ?? "");
    problems.push(judge("oversized body", `${key} declared 50 MB`, await send(key, spec, { body: valid, headers: { "content-length": String(50_000_000) } })) ?? "");
    problems.push(judge("wrong content type", `${key} text/plain`, await send(key, spec, { body: valid, headers: { "content-type": "text/plain" } })) ?? "");
    problems.push(judge("wrong content type", `${key} form`, await send(key, spec, { body: "a=1&b=2", headers: { "content-type": "application/x-www-form-urlencoded" } })) ?? "");
    for (const v of WRONG_TYPES) problems.push(judge("wrong type", `${key} (whole body) = ${JSON.stringify(v)}`, await send(key, { ...spec, body: v })) ?? "");

    for (const leaf of leaves(spec.body)) {
      for (const v of WRONG_TYPES) {
        if (JSON.stringify(v) === JSON.stringify(leaf.value)) continue;
        problems.push(judge("wrong type", `${label(key, leaf.path)} = ${JSON.stringify(v)}`, await send(key, { ...spec, body: withValue(spec.body, leaf.path, v) })) ?? "");
      }
      problems.push(judge("missing field", `${label(key, leaf.path)} left out`, await send(key, { ...spec, body: without(spec.body, leaf.path) })) ?? "");
    }
    // Prototype pollution: keys JSON.parse makes own properties must change nothing beyond the valid request.
    for (const k of ["__proto__", "constructor", "prototype"]) {
      const r = await send(key, spec, { body: `{"${k}":{"isAdmin":true,"roles":["admin"]},${valid.slice(1)}` });
      problems.push(judge("prototype pollution", `${key} ${k}`, r) ?? "");
      expect(({} as Record<string, unknown>).isAdmin, "Object.prototype polluted").toBeUndefined();
    }
    expect(problems.filter(Boolean)).toEqual([]);
  });

  const BODY_ROUTES = STATE_CHANGING.filter((k) => !["POST /api/evidence/[id]/confirm"].includes(k));

  it.each(BODY_ROUTES)("%s: script payloads, SQL-looking strings, traversal and special numbers in every field", async (key) => {
    const spec = await validSpec(key);
    if (spec.body === undefined) return;
    const problems: string[] = [];
    for (const leaf of leaves(spec.body)) {
      if (typeof leaf.value === "string") {
        // Is this field kept? A unique marker tells: if it is found stored, every accepted payload must be too, exactly.
        const marker = `probe-${leaf.path.join("-")}-7c1e`;
        const probe = await send(key, { ...spec, body: withValue(spec.body, leaf.path, marker) });
        const persisted = probe.status < 300 && storedSomewhere(marker);
        const sets: [Kind, string[]][] = [
          ["script payload", XSS],
          ["SQL-looking string", SQL],
          ["path traversal", TRAVERSAL],
        ];
        for (const [kind, payloads] of sets) {
          for (const p of payloads) {
            const r = await send(key, { ...spec, body: withValue(spec.body, leaf.path, p) });
            problems.push(judge(kind, `${label(key, leaf.path)} = ${JSON.stringify(p).slice(0, 40)}`, r, { payload: p, persisted, storedAs: SAFE_FORMS[leaf.path.join(".")] }) ?? "");
            if (r.status < 300 && kind === "SQL-looking string") expect(rowCounts().users, "users table intact").toBeGreaterThan(10);
          }
        }
      }
      if (typeof leaf.value === "number" || typeof leaf.value === "string") {
        for (const [name, literal] of NUMBERS) {
          const r = await send(key, spec, { body: withRawNumber(spec.body, leaf.path, literal) });
          problems.push(judge("special number", `${label(key, leaf.path)} = ${name}`, r) ?? "");
        }
      }
    }
    expect(problems.filter(Boolean)).toEqual([]);
  });

  it.each(BODY_ROUTES)("%s: property-based — random changes to the body never give a 5xx, junk or a refusal that stores", async (key) => {
    const spec = await validSpec(key);
    if (spec.body === undefined) return;
    const paths = leaves(spec.body).map((l) => l.path);
    const special = fc.constantFrom(...NUMBERS.map(([, literal]) => literal));
    const replacement = fc.oneof(
      fc.jsonValue({ maxDepth: 3 }).map((v) => ({ json: v })),
      fc.string({ unit: "grapheme", maxLength: 300 }).map((v) => ({ json: v })),
      fc.constantFrom(...XSS, ...SQL, ...TRAVERSAL).map((v) => ({ json: v })),
      special.map((literal) => ({ literal })),
    );
    const problems: string[] = [];
    await fc.assert(
      fc.asyncProperty(fc.array(fc.tuple(fc.constantFrom(...paths), replacement), { minLength: 1, maxLength: 3 }), async (changes) => {
        let body: unknown = spec.body;
        const raws: [Path, string][] = [];
        for (const [path, r] of changes) {
          if ("json" in r) body = withValue(body, path, r.json);
          else raws.push([path, r.literal]);
        }
        let text = JSON.stringify(body);
        for (const [path, literal] of raws) text = withRawNumber(JSON.parse(text), path, literal);
        const problem = judge("property-based", `${key} ${JSON.stringify(changes).slice(0, 160)}`, await send(key, spec, { body: text }));
        if (problem) problems.push(problem);
        return !problem;
      }),
      { numRuns: 25, seed: 20261201 },
    );
    expect(problems).toEqual([]);
  });

  const WITH_IDS = Object.keys(MATRIX).filter((k) => /\[\w+\]/.test(k) && !k.includes("/api/auth/"));

  it.each(WITH_IDS)("%s: hostile ids in the address are not found (4xx), and store nothing", async (key) => {
    const spec = await validSpec(key);
    const problems: string[] = [];
    for (const name of Object.keys(spec.params ?? {})) {
      for (const id of PATH_IDS) {
        const r = await send(key, { ...spec, params: { ...spec.params, [name]: id } });
        if (r.status < 400) problems.push(`${key} [${name}] = ${id.slice(0, 30)}: ${r.status}`);
        else problems.push(judge("hostile id in the address", `${key} [${name}] = ${id.slice(0, 30)}`, r) ?? "");
      }
    }
    expect(problems.filter(Boolean)).toEqual([]);
  });

  const QUERIES: [string, string[]][] = [
    ["GET /api/users", ["q", "role", "status"]],
    ["GET /api/people-picker", ["q", "role", "limit"]],
    ["GET /api/outbox", ["to"]],
    ["GET /api/audit", ["entityType", "entityId", "limit"]],
    ["GET /api/practicals", ["search", "topic", "yearGroup", "archived"]],
    ["GET /api/classes", ["archived"]],
    ["GET /api/lab-sessions", ["classId"]],
    ["GET /api/evidence", ["writeUpId", "practicalId"]],
    ["GET /api/class-progress/[id]", ["format"]],
  ];

  it.each(QUERIES)("%s: hostile query strings are answered (200 or a clear 400), never with more than the caller may see", async (key, names) => {
    const spec = await validSpec(key);
    const problems: string[] = [];
    const values = [...SQL, ...XSS, ...TRAVERSAL, ...NUMBERS.map(([, l]) => l), "x".repeat(10_000), ""];
    for (const name of names) {
      for (const v of values) {
        const query = `${name}=${encodeURIComponent(v)}${spec.query && !spec.query.startsWith(`${name}=`) ? `&${spec.query}` : ""}`;
        const r = await send(key, { ...spec, query });
        problems.push(judge("hostile query string", `${key}?${name}=${v.slice(0, 30)}`, r) ?? "");
        // A search for "' OR '1'='1" finds nobody: it is a string to look for, not SQL.
        if (r.status === 200 && SQL.includes(v) && ["q", "search", "to"].includes(name)) {
          const body = JSON.parse(r.text) as Record<string, unknown[]>;
          const list = body.people ?? body.messages ?? body.practicals ?? [];
          expect(list, `${key}?${name}=${v}`).toEqual([]);
        }
      }
    }
    expect(problems.filter(Boolean)).toEqual([]);
  });
});

describe("free text is stored verbatim and rendered inert", () => {
  /** Parses the markup as a browser would: no active elements, no event handlers, no script URLs. */
  const inert = (html: string) => {
    const { document } = new JSDOM(`<!doctype html><body>${html}</body>`).window;
    expect(document.querySelectorAll("script, iframe, object, embed, img, svg, style, link, meta, form, base").length, html).toBe(0);
    for (const el of document.querySelectorAll("*")) {
      for (const a of el.attributes) {
        expect(a.name.startsWith("on"), `${el.tagName} ${a.name}`).toBe(false);
        if (["href", "src", "action", "xlink:href", "formaction"].includes(a.name)) expect(a.value.trim()).toMatch(/^(https?:|mailto:|#)/i);
      }
    }
  };
  /** Every link mark in a stored document goes to http(s) or mailto, and only known node types remain. */
  const cleanDoc = (d: RichTextDoc) => {
    const walk = (n: { type: string; marks?: { type: string; attrs?: { href?: string } }[]; content?: unknown[] }) => {
      expect(["doc", "paragraph", "heading", "bulletList", "orderedList", "listItem", "blockquote", "blockMath", "horizontalRule", "codeBlock", "text", "hardBreak", "inlineMath"]).toContain(n.type);
      for (const m of n.marks ?? []) if (m.type === "link") expect(m.attrs?.href).toMatch(/^(https?:|mailto:)/i);
      for (const c of n.content ?? []) walk(c as never);
    };
    walk(d as never);
  };
  const doc = (...content: object[]) => ({ type: "doc", content });
  const p = (...content: object[]) => ({ type: "paragraph", content });
  const t = (text: string, marks?: object[]) => ({ type: "text", text, ...(marks ? { marks } : {}) });

  /** Rich-text documents a hostile editor (or a hand-made request) might send. */
  const HOSTILE_DOCS: [string, unknown][] = [
    ["script in text", doc(p(t("<script>alert(1)</script>")))],
    ["img onerror in text", doc(p(t('"><img src=x onerror=alert(1)>')))],
    ["javascript: link", doc(p(t("click", [{ type: "link", attrs: { href: "javascript:alert(1)" } }])))],
    ["data: link", doc(p(t("click", [{ type: "link", attrs: { href: "data:text/html,<script>alert(1)</script>" } }])))],
    ["link with onclick attribute", doc(p(t("click", [{ type: "link", attrs: { href: "https://example.org", onclick: "alert(1)" } }])))],
    ["unknown node type", doc({ type: "script", content: [t("alert(1)")] })],
    ["html node", doc({ type: "html", attrs: { html: "<img src=x onerror=alert(1)>" } })],
    ["attribute on paragraph", doc({ type: "paragraph", attrs: { style: "background:url(javascript:alert(1))", onmouseover: "alert(1)" }, content: [t("hover")] })],
    ["KaTeX \\href", doc(p({ type: "inlineMath", attrs: { latex: "\\href{javascript:alert(1)}{x}" } }))],
    ["KaTeX \\url", doc(p({ type: "inlineMath", attrs: { latex: "\\url{javascript:alert(1)}" } }))],
    ["KaTeX \\htmlData", doc({ type: "blockMath", attrs: { latex: "\\htmlData{onload=alert(1)}{x}" } })],
    ["KaTeX raw html", doc(p({ type: "inlineMath", attrs: { latex: "<img src=x onerror=alert(1)>" } }))],
    ["unknown mark", doc(p(t("x", [{ type: "script" }])))],
    ["text with marks as a string", doc(p({ type: "text", text: "x", marks: "<script>" }))],
    ["nested too deep", (() => { let n: object = t("deep"); for (let i = 0; i < 40; i++) n = { type: "blockquote", content: [n] }; return doc(n); })()],
    ["far too long", doc(p(t("<script>".repeat(20_000))))],
    ["not a doc", { type: "paragraph", content: [t("<script>alert(1)</script>")] }],
    ["html string instead of a document", "<p><script>alert(1)</script></p>"],
  ];

  it.each(HOSTILE_DOCS)("a write-up section holding %s is refused, or stored cleaned and rendered inert", async (name, hostile) => {
    const key = "PUT /api/write-ups/[id]";
    const spec = await validSpec(key);
    const body = withValue(spec.body, ["content", "sections", "plan"], hostile);
    const r = await send(key, spec, { body: JSON.stringify(body) });
    expect(judge("rich-text payload", `${key} ${name}`, r), r.text.slice(0, 200)).toBeNull();
    if (r.status >= 300) return;
    const stored = JSON.parse((getHandle().sqlite.prepare("SELECT content FROM write_ups WHERE id = ?").get(world.draftWriteUpId) as { content: string }).content).sections.plan as RichTextDoc;
    cleanDoc(stored);
    inert(renderToStaticMarkup(createElement(RichTextView, { doc: stored })));
  });

  it.each(HOSTILE_DOCS)("a practical's introduction holding %s is refused, or stored cleaned and rendered inert", async (name, hostile) => {
    const key = "PUT /api/practical-versions/[id]";
    const spec = await validSpec(key);
    const body = withValue(spec.body, ["content", "introduction"], hostile);
    const r = await send(key, spec, { body: JSON.stringify(body) });
    expect(judge("rich-text payload", `${key} ${name}`, r), r.text.slice(0, 200)).toBeNull();
    if (r.status >= 300) return;
    const stored = JSON.parse((getHandle().sqlite.prepare("SELECT content FROM practical_versions WHERE id = ?").get(world.draftVersionId) as { content: string }).content).introduction as RichTextDoc;
    cleanDoc(stored);
    inert(renderToStaticMarkup(createElement(RichTextView, { doc: stored })));
  });

  it.each(XSS)("script payload %s in plain text is stored as typed and shown as text", async (payload) => {
    // A plain-text field shown with links (outbox messages, captions, feedback): React escapes it; only http(s) becomes a link.
    const html = renderToStaticMarkup(createElement(LinkedText, { text: `${payload} see https://example.org/a?b=1` }));
    inert(html);
    expect(html).toContain('href="https://example.org/a?b=1"');
    // A caption (free text) comes back exactly as typed.
    const key = "PATCH /api/evidence/[id]";
    const spec = await validSpec(key);
    const r = await send(key, { ...spec, body: { caption: payload } });
    expect(r.status).toBe(200);
    expect(JSON.parse(r.text).caption).toBe(payload);
    expect((getHandle().sqlite.prepare("SELECT caption FROM evidence WHERE id = ?").get(world.readyEvidenceId) as { caption: string }).caption).toBe(payload);
    inert(renderToStaticMarkup(createElement("figcaption", null, payload)));
  });

  it("a photo's file name with path traversal never reaches a storage key", async () => {
    const key = "POST /api/evidence";
    const spec = await validSpec(key);
    for (const filename of TRAVERSAL) {
      const r = await send(key, { ...spec, body: { ...(spec.body as object), filename } });
      expect(judge("path traversal", `${key} filename ${filename}`, r)).toBeNull();
      if (r.status >= 300) continue;
      const row = getHandle().sqlite.prepare("SELECT upload_key AS key, original_name AS name FROM evidence WHERE id = ?").get(JSON.parse(r.text).id) as { key: string; name: string };
      expect(row.key).toMatch(new RegExp(`^schools/${world.schoolId}/write-ups/${world.draftWriteUpId}/uploads/[0-9a-f-]{36}$`));
      expect(row.name).not.toMatch(/[\\/]/);
      expect(new URL(JSON.parse(r.text).uploadUrl).pathname).not.toContain("..");
    }
  });
});
