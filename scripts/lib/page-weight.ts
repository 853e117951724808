import fs from "node:fs";
import path from "node:path";
import { gzipSync } from "node:zlib";

/**
 * First-load JS per page route of the last production build, gzip-compressed:
 * the framework's root chunks plus every chunk the route's layouts and page
 * load (from each page's client reference manifest). Also names the heaviest
 * chunks and the client modules that pull each in.
 */
export interface RouteWeight {
  route: string;
  gzipBytes: number;
  chunks: string[];
}

interface Manifest {
  clientModules: Record<string, { chunks: string[] }>;
  entryJSFiles: Record<string, string[]>;
}

function readManifest(file: string): Manifest {
  const text = fs.readFileSync(file, "utf8");
  return JSON.parse(text.slice(text.indexOf("= {") + 2).replace(/;\s*$/, "")) as Manifest;
}

function manifests(dir: string, out: string[] = []): string[] {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) manifests(full, out);
    else if (entry.name === "page_client-reference-manifest.js") out.push(full);
  }
  return out;
}

export function pageWeights(root = ".next"): { routes: RouteWeight[]; heaviest: { chunk: string; gzipBytes: number; modules: string[] }[] } {
  const build = JSON.parse(fs.readFileSync(path.join(root, "build-manifest.json"), "utf8")) as { rootMainFiles: string[] };
  const gz = new Map<string, number>();
  const sizeOf = (chunk: string) => {
    const file = path.join(root, chunk.replace(/^\/_next\//, ""));
    if (!gz.has(chunk)) gz.set(chunk, fs.existsSync(file) ? gzipSync(fs.readFileSync(file)).length : 0);
    return gz.get(chunk)!;
  };
  const moduleOfChunk = new Map<string, Set<string>>();
  const routes: RouteWeight[] = [];
  const appDir = path.join(root, "server", "app");
  for (const file of manifests(appDir)) {
    const manifest = readManifest(file);
    const route = "/" + path.relative(appDir, path.dirname(file)).split(path.sep).filter((s) => !/^\(.*\)$/.test(s)).join("/");
    const chunks = new Set<string>(build.rootMainFiles);
    for (const list of Object.values(manifest.entryJSFiles)) for (const c of list) chunks.add(c);
    for (const [name, mod] of Object.entries(manifest.clientModules)) {
      for (const c of mod.chunks) {
        const key = c.replace(/^\/_next\//, "");
        if (!moduleOfChunk.has(key)) moduleOfChunk.set(key, new Set());
        moduleOfChunk.get(key)!.add(name.replace(/^\[project\]\//, "").replace(/ <.*$/, ""));
      }
    }
    routes.push({ route: route === "/" ? "/" : route, gzipBytes: [...chunks].reduce((n, c) => n + sizeOf(c), 0), chunks: [...chunks] });
  }
  routes.sort((a, b) => b.gzipBytes - a.gzipBytes);
  const heaviest = [...new Set(routes.flatMap((r) => r.chunks))]
    .map((chunk) => ({ chunk, gzipBytes: sizeOf(chunk), modules: [...(moduleOfChunk.get(chunk) ?? [])] }))
    .sort((a, b) => b.gzipBytes - a.gzipBytes)
    .slice(0, 6);
  return { routes, heaviest };
}

/** Prints the table; the aim is at most 180 kB gzip per route. */
export function printPageWeights(root = ".next"): void {
  const { routes, heaviest } = pageWeights(root);
  const kb = (n: number) => (n / 1024).toFixed(1);
  console.log(`\nFirst-load JS per page (gzip; aim ≤ 180 kB)`);
  for (const r of routes) console.log(`  ${r.route.padEnd(44)}${kb(r.gzipBytes).padStart(8)} kB${r.gzipBytes > 180 * 1024 ? "  over the aim" : ""}`);
  console.log(`\nHeaviest chunks (gzip) and the client modules that load them`);
  for (const h of heaviest) {
    const named = h.modules.filter((m) => !m.startsWith("node_modules/next/")).slice(0, 4);
    const framework = h.modules.length > 0 && named.length === 0 ? "the framework (next, react)" : named.join(", ") || "the framework runtime";
    console.log(`  ${h.chunk.padEnd(40)}${kb(h.gzipBytes).padStart(8)} kB  ${framework}`);
  }
}

if (process.argv[1]?.endsWith("page-weight.ts")) printPageWeights();
