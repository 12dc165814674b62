import http from "node:http";
import { describe, expect, it } from "vitest";
import { trySignIn } from "../helpers/http-sign-in";
import { baseURL } from "./support/chromium";
import { DEMO, DEMO_PASSWORD } from "./support/demo";

/**
 * The browser-test server runs as `npm start` does on this machine: two workers sharing the port
 * (scripts/serve.mjs). Each request below goes on a new connection, and the cluster hands new
 * connections to the workers in turn, so consecutive requests reach different workers. What one
 * worker knows, the other must know too.
 */
describe("two server workers", () => {
  it("count wrong passwords together: the sixth try for an account is refused as rate-limited", async () => {
    // An address no one has, so no other test's sign-in is locked out by this one.
    const email = `nobody-${Date.now()}@two-workers.invalid`;
    const errors: (string | null)[] = [];
    for (let i = 0; i < 6; i++) errors.push((await trySignIn(baseURL(), email, "not the password")).error);
    // Five wrong passwords are refused as wrong; the limit (5 per account per 15 minutes) then
    // refuses the sixth before the password is looked at. Counted in one worker only, the sixth
    // would reach a worker that had seen three and be refused as merely wrong.
    expect(errors).toEqual(["CredentialsSignin", "CredentialsSignin", "CredentialsSignin", "CredentialsSignin", "CredentialsSignin", "RateLimited"]);
  });

  it("both answer, with the same signed-in person", async () => {
    const cookie = (await trySignIn(baseURL(), DEMO.teacher.email, DEMO_PASSWORD)).cookie;
    expect(cookie).not.toBe("");
    // Eight requests on eight new connections: four to each worker.
    const statuses = await Promise.all(
      Array.from(
        { length: 8 },
        () =>
          new Promise<number>((resolve, reject) => {
            const req = http.request(`${baseURL()}/api/lab-sessions`, { headers: { cookie }, agent: false }, (res) => {
              res.resume();
              res.on("end", () => resolve(res.statusCode ?? 0));
            });
            req.on("error", reject);
            req.end();
          }),
      ),
    );
    expect(statuses).toEqual(Array(8).fill(200));
  });
});
