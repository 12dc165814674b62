import fs from "node:fs";
import path from "node:path";
import { startFakeS3 } from "@/lib/dev/fake-s3";
import { startFakeSmtp } from "@/lib/dev/fake-smtp";
import { ensureBucket, storageSettings } from "@/lib/storage";

/** The built-in mail catcher and local S3 server on free loopback ports, for a whole test file. */
export async function startServers(name: string) {
  const dir = path.join("tests", ".tmp", `${name}-s3-${process.pid}-${Date.now()}`);
  const smtp = await startFakeSmtp(0);
  const s3 = await startFakeS3({ port: 0, directory: dir, bucket: storageSettings().bucket });
  await ensureBucket();
  return {
    s3Port: s3.port,
    async close() {
      await Promise.allSettled([smtp.close(), s3.close()]);
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
