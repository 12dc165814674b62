import "server-only";
import {
  CreateBucketCommand,
  DeleteObjectsCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  PutBucketCorsCommand,
  PutObjectCommand,
  S3Client,
  type S3ClientConfig,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { createHash } from "node:crypto";
import { fakeS3Port } from "./dev/fake-s3-state";

/**
 * Object storage for photo evidence, on any S3-compatible service. Settings come from the
 * environment (S3_ENDPOINT, S3_REGION, S3_BUCKET, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY, and
 * S3_PUBLIC_ENDPOINT when browsers reach the service at another address). Without S3_ENDPOINT
 * the built-in local fake S3 server is used.
 */
export type StorageSettings = { endpoint: string; publicEndpoint: string; region: string; bucket: string; accessKeyId: string; secretAccessKey: string; isFake: boolean };

export function storageSettings(): StorageSettings {
  if (process.env.S3_ENDPOINT) {
    const endpoint = process.env.S3_ENDPOINT.replace(/\/+$/, "");
    return {
      endpoint,
      publicEndpoint: (process.env.S3_PUBLIC_ENDPOINT || endpoint).replace(/\/+$/, ""),
      region: process.env.S3_REGION || "us-east-1",
      bucket: process.env.S3_BUCKET || "meniscus-evidence",
      accessKeyId: process.env.S3_ACCESS_KEY_ID || "",
      secretAccessKey: process.env.S3_SECRET_ACCESS_KEY || "",
      isFake: false,
    };
  }
  const endpoint = `http://127.0.0.1:${fakeS3Port()}`;
  // The fake server only accepts this fixed key pair.
  return { endpoint, publicEndpoint: process.env.S3_PUBLIC_ENDPOINT || endpoint, region: "us-east-1", bucket: process.env.S3_BUCKET || "meniscus-evidence", accessKeyId: "S3RVER", secretAccessKey: "S3RVER", isFake: true };
}

const clients = new Map<string, S3Client>();

function client(endpoint: string, s: StorageSettings): S3Client {
  const key = `${endpoint}|${s.region}|${s.accessKeyId}`;
  let c = clients.get(key);
  if (!c) {
    const config: S3ClientConfig = {
      endpoint,
      region: s.region,
      forcePathStyle: true,
      credentials: { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey },
      // Plain bodies and no empty-body checksums: required by the fake server and several real ones.
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
    };
    c = new S3Client(config);
    // Some S3 services refuse a multi-object delete without Content-MD5.
    c.middlewareStack.add(
      (next) => async (args) => {
        const req = args.request as { headers?: Record<string, string>; body?: unknown; query?: Record<string, unknown> };
        if (req.query && "delete" in req.query && typeof req.body === "string" && req.headers && !req.headers["content-md5"]) {
          req.headers["content-md5"] = createHash("md5").update(req.body).digest("base64");
        }
        return next(args);
      },
      { step: "build", name: "contentMd5ForDeleteObjects" },
    );
    clients.set(key, c);
  }
  return c;
}

const internal = () => {
  const s = storageSettings();
  return { s, c: client(s.endpoint, s) };
};

const CORS = {
  CORSRules: [{ AllowedOrigins: ["*"], AllowedMethods: ["GET", "PUT", "HEAD"], AllowedHeaders: ["*"], ExposeHeaders: ["ETag"], MaxAgeSeconds: 3000 }],
};

/** Creates the bucket (with CORS for browser uploads) if it does not exist. */
export async function ensureBucket(): Promise<void> {
  const { s, c } = internal();
  try {
    await c.send(new HeadBucketCommand({ Bucket: s.bucket }));
  } catch {
    await c.send(new CreateBucketCommand({ Bucket: s.bucket }));
  }
  try {
    await c.send(new PutBucketCorsCommand({ Bucket: s.bucket, CORSConfiguration: CORS }));
  } catch (e) {
    // Some services manage CORS outside the S3 API; uploads from the browser need it set there.
    console.warn("[meniscus] could not set CORS on the evidence bucket:", (e as Error).message);
  }
}

/** A URL the browser can PUT one object to, valid for a few minutes; the content type is signed. */
export async function presignUpload(key: string, contentType: string, expiresInSeconds = 600): Promise<string> {
  const s = storageSettings();
  return getSignedUrl(client(s.publicEndpoint, s), new PutObjectCommand({ Bucket: s.bucket, Key: key, ContentType: contentType }), {
    expiresIn: expiresInSeconds,
    signableHeaders: new Set(["content-type"]),
  });
}

/** A short-lived URL to read one object (minutes, not hours). */
export async function presignDownload(key: string, expiresInSeconds = 300): Promise<string> {
  const s = storageSettings();
  return getSignedUrl(client(s.publicEndpoint, s), new GetObjectCommand({ Bucket: s.bucket, Key: key }), { expiresIn: expiresInSeconds });
}

export async function headObject(key: string): Promise<{ size: number; contentType: string | undefined } | null> {
  const { s, c } = internal();
  try {
    const r = await c.send(new HeadObjectCommand({ Bucket: s.bucket, Key: key }));
    return { size: Number(r.ContentLength ?? 0), contentType: r.ContentType };
  } catch (e) {
    const status = (e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
    if (status === 404 || (e as Error).name === "NotFound" || (e as Error).name === "NoSuchKey") return null;
    throw e;
  }
}

export async function getObjectBytes(key: string): Promise<Buffer> {
  const { s, c } = internal();
  const r = await c.send(new GetObjectCommand({ Bucket: s.bucket, Key: key }));
  return Buffer.from(await r.Body!.transformToByteArray());
}

export async function putObject(key: string, body: Buffer, contentType: string): Promise<void> {
  const { s, c } = internal();
  await c.send(new PutObjectCommand({ Bucket: s.bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.length }));
}

export async function deleteObjects(keys: readonly string[]): Promise<void> {
  const list = keys.filter(Boolean);
  if (!list.length) return;
  const { s, c } = internal();
  await c.send(new DeleteObjectsCommand({ Bucket: s.bucket, Delete: { Objects: list.map((Key) => ({ Key })), Quiet: true } }));
}

/** Object keys are scoped by school and by what they belong to. */
export function evidenceKeys(schoolId: string, owner: { writeUpId?: string | null; practicalId?: string | null }, evidenceId: string) {
  const base = owner.writeUpId ? `schools/${schoolId}/write-ups/${owner.writeUpId}` : `schools/${schoolId}/practicals/${owner.practicalId}`;
  return { upload: `${base}/uploads/${evidenceId}`, image: `${base}/images/${evidenceId}.jpg`, thumb: `${base}/thumbs/${evidenceId}.jpg` };
}
