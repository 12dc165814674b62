const ALPHABET = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789";

/** The pattern the server accepts for ids of columns, checks, criteria and the like. */
export const PART_ID_PATTERN = /^[A-Za-z0-9_-]{1,40}$/;

/**
 * A short random id for a new part of a practical (a column, check, criterion, level or hazard),
 * made in the browser so a part keeps its id when it is moved, renamed or saved. The prefix says
 * what the part is, which helps when reading a stored document; 10 random characters from 62
 * make a clash within one practical vanishingly unlikely, and `taken` rules out even that.
 */
export function newPartId(prefix: string, taken: Iterable<string> = []): string {
  const safePrefix = prefix.replace(/[^A-Za-z0-9]/g, "").slice(0, 12) || "p";
  const used = new Set(taken);
  for (;;) {
    const bytes = new Uint8Array(10);
    crypto.getRandomValues(bytes);
    let body = "";
    for (const b of bytes) body += ALPHABET[b % ALPHABET.length];
    const id = `${safePrefix}_${body}`;
    if (!used.has(id)) return id;
  }
}
