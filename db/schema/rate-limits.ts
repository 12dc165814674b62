import { integer, sqliteTable, text } from "drizzle-orm/sqlite-core";

/**
 * Counters for rate limits (wrong passwords per account and per network address, password-reset
 * e-mails), in the database so that every server worker counts together and a restart does not
 * reset them. The columns are the ones rate-limiter-flexible's SQLite store reads and writes:
 * `expire` is in milliseconds since 1970.
 */
export const rateLimits = sqliteTable("rate_limits", {
  key: text("key").primaryKey(),
  points: integer("points").notNull().default(0),
  expire: integer("expire"),
});
