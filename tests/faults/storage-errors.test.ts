import Database from "better-sqlite3";
import { describe, expect, it } from "vitest";
import { errorResponse } from "@/lib/api";

// Real SQLite failures, not invented error objects: a database that has reached its size limit
// (SQLite reports SQLITE_FULL exactly as for a full disk) and a connection that may not write.
function sqliteError(setup: (db: Database.Database) => void): unknown {
  const db = new Database(":memory:");
  try {
    db.exec("CREATE TABLE notes (body TEXT)");
    setup(db);
    for (let i = 0; i < 10_000; i++) db.prepare("INSERT INTO notes VALUES (?)").run("x".repeat(4000));
  } catch (e) {
    return e;
  } finally {
    db.close();
  }
  throw new Error("expected SQLite to refuse the write");
}

describe("storage failures become a clear 503", () => {
  it("answers a full disk with a plain message, not a 500", async () => {
    const err = sqliteError((db) => db.pragma("max_page_count = 8"));
    expect((err as { code?: string }).code).toBe("SQLITE_FULL");
    const res = errorResponse(err);
    expect(res.status).toBe(503);
    const body = (await res.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("unavailable");
    expect(body.error.message).toMatch(/cannot save right now/);
    expect(body.error.message).toMatch(/disk is full/);
    expect(JSON.stringify(body)).not.toMatch(/SQLITE|stack|at /);
  });

  it("answers a read-only database with a plain message, not a 500", async () => {
    const err = sqliteError((db) => db.pragma("query_only = ON"));
    expect((err as { code?: string }).code).toBe("SQLITE_READONLY");
    const res = errorResponse(err);
    expect(res.status).toBe(503);
    const body = (await res.json()) as { error: { code: string; message: string } };
    expect(body.error.message).toMatch(/cannot save right now: the database is read-only/);
    expect(JSON.stringify(body)).not.toMatch(/SQLITE|stack/);
  });

  it("still answers other unexpected errors with a 500 that shows no detail", async () => {
    const res = errorResponse(new Error("secret internals at /srv/app.js:1"));
    expect(res.status).toBe(500);
    expect(JSON.stringify(await res.json())).not.toMatch(/secret internals/);
  });
});

describe("a request cut off on its way in", () => {
  it("is a 400 asking to try again, not a 500 logged as a server fault", async () => {
    const { z } = await import("zod");
    const { readJson } = await import("@/lib/api");
    // A body that stops part-way, as when the connection drops mid-upload (Node's fetch Request
    // errors its body stream the same way when the socket closes).
    const body = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(new TextEncoder().encode('{"revision":3,"content":{"sect'));
        controller.error(Object.assign(new Error("aborted"), { code: "ECONNRESET" }));
      },
    });
    const req = new Request("http://localhost:3000/api/write-ups/x", { method: "PUT", headers: { "content-type": "application/json" }, body, duplex: "half" } as RequestInit);
    const err = await readJson(req, z.object({ revision: z.number() })).catch((e: unknown) => e);
    const res = errorResponse(err);
    expect(res.status).toBe(400);
    const answer = (await res.json()) as { error: { code: string; message: string } };
    expect(answer.error.message).toMatch(/cut off.*Try again/);
  });
});
