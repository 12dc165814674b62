// Shared between the module that starts the fake mail server and the one that sends mail; the
// two may be bundled separately, so the port lives on globalThis.
const g = globalThis as unknown as { __meniscusFakeSmtpPort?: number };

export function fakeSmtpPort(): number {
  return g.__meniscusFakeSmtpPort ?? Number(process.env.MAIL_FAKE_PORT || 2525);
}

export function setFakeSmtpPort(port: number): void {
  g.__meniscusFakeSmtpPort = port;
}
