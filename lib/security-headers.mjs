// Security headers for every response, and the Content-Security-Policy for pages. Plain
// JavaScript so that next.config.mjs (headers for all routes) and proxy.ts (a per-request nonce
// for pages) share one definition. No imports: it runs in the config loader and in the proxy.

/**
 * Origins the browser talks to for photo evidence: the presigned PUT of an upload and the
 * presigned GETs of images go straight to the S3 service's public address
 * (S3_PUBLIC_ENDPOINT, else S3_ENDPOINT). Without S3_ENDPOINT the built-in local S3 server is on
 * 127.0.0.1 at S3_FAKE_PORT (4569); port 0 means "a free port chosen at start", so any port of
 * 127.0.0.1 is allowed then.
 * @param {Record<string, string | undefined>} [env]
 * @returns {string[]}
 */
export function storageOrigins(env = process.env) {
  const configured = env.S3_PUBLIC_ENDPOINT || env.S3_ENDPOINT;
  if (configured) {
    try {
      return [new URL(configured).origin];
    } catch {
      return [];
    }
  }
  const port = env.S3_FAKE_PORT ?? "4569";
  return [port === "0" ? "http://127.0.0.1:*" : `http://127.0.0.1:${Number(port) || 4569}`];
}

/** Whether the app is served over https (cookies Secure, HSTS, upgrade of insecure requests). */
function servedOverHttps(env) {
  return /^https:\/\//i.test(env.APP_URL || env.NEXTAUTH_URL || "");
}

/**
 * The policy for pages. Scripts: only Next's own, carrying this response's nonce, and what they
 * load ('strict-dynamic'); no eval outside development. Styles: 'unsafe-inline' is needed for
 * the style attributes React, the rich-text editor (TipTap), KaTeX and Chart.js set. Images:
 * this origin, blob: and data: (photo previews before upload, chart exports) and the S3 service.
 * Fonts: this origin (KaTeX and the body font are bundled). Nothing may frame Meniscus.
 * @param {{ nonce?: string, env?: Record<string, string | undefined>, dev?: boolean }} [options]
 * @returns {string}
 */
export function contentSecurityPolicy({ nonce, env = process.env, dev = env.NODE_ENV === "development" } = {}) {
  const storage = storageOrigins(env).join(" ");
  const directives = [
    "default-src 'self'",
    `script-src 'self'${nonce ? ` 'nonce-${nonce}' 'strict-dynamic'` : ""}${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    `img-src 'self' blob: data: ${storage}`.trim(),
    "font-src 'self' data:",
    `connect-src 'self' ${storage}`.trim(),
    "media-src 'self' blob:",
    "worker-src 'self' blob:",
    "manifest-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-src 'none'",
    "frame-ancestors 'none'",
  ];
  if (servedOverHttps(env)) directives.push("upgrade-insecure-requests");
  return directives.join("; ");
}

/** Route handlers answer JSON, CSV, PDF or zip: nothing in them may run or be framed. */
export const API_CONTENT_SECURITY_POLICY = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

/**
 * Headers for every response. Students photograph their apparatus with the phone's camera from
 * the write-up page, so the camera is allowed for this origin; everything else is off.
 * @param {Record<string, string | undefined>} [env]
 * @returns {{ key: string, value: string }[]}
 */
export function securityHeaders(env = process.env) {
  const headers = [
    { key: "X-Content-Type-Options", value: "nosniff" },
    { key: "Referrer-Policy", value: "same-origin" },
    { key: "X-Frame-Options", value: "DENY" },
    { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
    { key: "Cross-Origin-Resource-Policy", value: "same-origin" },
    {
      key: "Permissions-Policy",
      value: "camera=(self), microphone=(), geolocation=(), payment=(), usb=(), serial=(), bluetooth=(), hid=(), midi=(), magnetometer=(), gyroscope=(), accelerometer=(), display-capture=(), browsing-topics=()",
    },
  ];
  if (servedOverHttps(env)) headers.push({ key: "Strict-Transport-Security", value: "max-age=31536000; includeSubDomains" });
  return headers;
}
