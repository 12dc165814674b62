// First-load JavaScript per route of a production build, computed from the build's manifests
// (Next 16 with Turbopack no longer prints sizes): the root main chunks plus every entry chunk
// the route's client reference manifest lists (root layout, nested layouts, error and not-found
// boundaries, the page), each gzip-compressed, summed. Async chunks loaded later are not counted.
import fs from "node:fs";
import path from "node:path";
import vm from "node:vm";
import zlib from "node:zlib";

export type RouteSize = { route: string; chunks: number; rawBytes: number; gzipBytes: number };

/** "/(app)/lab-sessions/[id]/write-up/page" → "/lab-sessions/[id]/write-up". */
export function routeName(entry: string): string {
  const route = entry
    .replace(/\/page$/, "")
    .split("/")
    .filter((s) => s && !(s.startsWith("(") && s.endsWith(")")))
    .join("/");
  return `/${route}`;
}

export function firstLoadJs(distDir: string): RouteSize[] {
  const build = JSON.parse(fs.readFileSync(path.join(distDir, "build-manifest.json"), "utf8")) as { rootMainFiles: string[] };
  const pages = JSON.parse(fs.readFileSync(path.join(distDir, "server", "app-paths-manifest.json"), "utf8")) as Record<string, string>;
  const gz = new Map<string, { raw: number; gzip: number }>();
  const sizeOf = (file: string) => {
    let s = gz.get(file);
    if (!s) {
      const bytes = fs.readFileSync(path.join(distDir, file));
      s = { raw: bytes.length, gzip: zlib.gzipSync(bytes).length };
      gz.set(file, s);
    }
    return s;
  };
  const out: RouteSize[] = [];
  for (const [entry, file] of Object.entries(pages)) {
    if (!entry.endsWith("/page")) continue;
    const manifestFile = path.join(distDir, "server", file.replace(/\.js$/, "_client-reference-manifest.js"));
    if (!fs.existsSync(manifestFile)) continue;
    const sandbox: { globalThis?: unknown; __RSC_MANIFEST?: Record<string, { entryJSFiles?: Record<string, string[]> }> } = {};
    sandbox.globalThis = sandbox;
    vm.runInNewContext(fs.readFileSync(manifestFile, "utf8"), sandbox);
    const manifest = sandbox.__RSC_MANIFEST?.[entry];
    const files = new Set<string>(build.rootMainFiles);
    for (const list of Object.values(manifest?.entryJSFiles ?? {})) for (const f of list) files.add(f.replace(/^\/?_next\//, ""));
    let rawBytes = 0;
    let gzipBytes = 0;
    for (const f of files) {
      const s = sizeOf(f);
      rawBytes += s.raw;
      gzipBytes += s.gzip;
    }
    out.push({ route: routeName(entry), chunks: files.size, rawBytes, gzipBytes });
  }
  return out.sort((a, b) => a.route.localeCompare(b.route));
}
