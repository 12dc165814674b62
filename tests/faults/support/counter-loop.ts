// One of two processes writing the same SQLite file, as two server workers do: many short
// transactions that read a counter and then write it back one higher (the shape of an autosave:
// read the revision, check it, write the next one). Run by two-processes-one-file.test.ts.
import { eq } from "drizzle-orm";
import { openDatabase } from "@/db/client";
import { rateLimits } from "@/db/schema";

const [file, times, startAt] = [process.argv[2]!, Number(process.argv[3]), Number(process.argv[4])];
const { db, sqlite } = openDatabase(file);
while (Date.now() < startAt) {
  // both processes begin together
}
let errors = 0;
const codes = new Set<string>();
for (let i = 0; i < times; i++) {
  try {
    db.transaction((tx) => {
      const row = tx.select().from(rateLimits).where(eq(rateLimits.key, "shared-counter")).get();
      tx.update(rateLimits)
        .set({ points: row!.points + 1 })
        .where(eq(rateLimits.key, "shared-counter"))
        .run();
    });
  } catch (e) {
    errors++;
    codes.add((e as { code?: string }).code ?? String(e));
  }
}
sqlite.close();
process.stdout.write(JSON.stringify({ errors, codes: [...codes] }));
