import "server-only";
import fs from "node:fs";
import type { AddressInfo } from "node:net";
import path from "node:path";
import S3rver from "s3rver";
import { setFakeS3Port } from "./fake-s3-state";

const CORS_XML = `<CORSConfiguration><CORSRule><AllowedOrigin>*</AllowedOrigin><AllowedMethod>PUT</AllowedMethod><AllowedMethod>GET</AllowedMethod><AllowedMethod>HEAD</AllowedMethod><AllowedHeader>*</AllowedHeader><ExposeHeader>ETag</ExposeHeader><MaxAgeSeconds>3000</MaxAgeSeconds></CORSRule></CORSConfiguration>`;

/**
 * The built-in S3-compatible server (s3rver) on loopback, storing objects in a folder. Used by
 * default and by the tests; set S3_ENDPOINT to use MinIO or any S3 service instead.
 */
export async function startFakeS3({ port, directory, bucket }: { port: number; directory: string; bucket: string }): Promise<{ port: number; close: () => Promise<void> }> {
  fs.mkdirSync(directory, { recursive: true });
  const server = new S3rver({ port, address: "127.0.0.1", directory: path.resolve(directory), silent: true, configureBuckets: [{ name: bucket, configs: [CORS_XML] }] });
  const info = (await server.run()) as unknown as AddressInfo;
  setFakeS3Port(info.port);
  return { port: info.port, close: () => server.close() as unknown as Promise<void> };
}
