// Shared between the module that starts the fake S3 server and the storage client (they may be
// bundled separately), so the port lives on globalThis.
const g = globalThis as unknown as { __meniscusFakeS3Port?: number };

export function fakeS3Port(): number {
  return g.__meniscusFakeS3Port ?? Number(process.env.S3_FAKE_PORT || 4569);
}

export function setFakeS3Port(port: number): void {
  g.__meniscusFakeS3Port = port;
}

/** Whether this process started the built-in S3 server (the demo seed only uploads to one that is running). */
export function fakeS3Started(): boolean {
  return g.__meniscusFakeS3Port !== undefined;
}
