import "server-only";
import type { AddressInfo } from "node:net";
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer } from "smtp-server";
import { storeReceivedMail } from "@/db/queries/outbox";
import { setFakeSmtpPort } from "./fake-smtp-state";

const MAX_MESSAGE_BYTES = 15 * 1024 * 1024;

function addresses(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return "";
  return (Array.isArray(a) ? a : [a]).flatMap((x) => x.value.map((v) => v.address ?? "")).filter(Boolean).join(", ");
}

/**
 * The built-in mail catcher: a real SMTP server on loopback that stores every message it receives
 * in the database instead of delivering it. Used by default and by the tests.
 */
export async function startFakeSmtp(port: number): Promise<{ port: number; close: () => Promise<void> }> {
  const server = new SMTPServer({
    authOptional: true,
    allowInsecureAuth: true,
    // The certificate bundled with smtp-server has expired; loopback needs no TLS.
    disabledCommands: ["STARTTLS"],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", async () => {
        try {
          const raw = Buffer.concat(chunks);
          const parsed = await simpleParser(raw);
          const school = parsed.headers.get("x-meniscus-school");
          storeReceivedMail({
            schoolId: typeof school === "string" ? school : null,
            messageId: parsed.messageId ?? null,
            from: addresses(parsed.from),
            to: addresses(parsed.to),
            subject: parsed.subject ?? "(no subject)",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
            attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? "attachment", contentType: a.contentType, size: a.size })),
            raw: raw.toString("utf8"),
          });
          callback();
        } catch (e) {
          callback(e as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  const bound = (server.server.address() as AddressInfo).port;
  setFakeSmtpPort(bound);
  return { port: bound, close: () => new Promise((r) => server.close(() => r())) };
}
