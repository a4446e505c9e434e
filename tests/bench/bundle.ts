// `npm run bench -- bundle`: the JavaScript each page makes a browser load before it is
// interactive, compressed (gzip, as the app's server sends it), read from the production build's
// route manifest: the client entry, the root route and the page's route module, each with the
// chunks it imports. Chunks a page loads later (a dynamic import) are not counted. Prints the
// pages over the 150 kB target first; asserts nothing.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { gzipSync } from "node:zlib";
import { buildForBench } from "./stack";

const TARGET_KB = 150;
/** The pages the target names: the spec form's steps (intake) and quick sizing. */
const TARGET_ROUTES = ["routes/spec-step", "routes/quick-sizing"];

interface ManifestEntry {
  module: string;
  imports?: string[];
}
interface Manifest {
  entry: ManifestEntry;
  routes: Record<string, ManifestEntry & { hasDefaultExport?: boolean }>;
}

/** The build's route manifest: `window.__reactRouterManifest={…};` in assets/manifest-<hash>.js. */
function readManifest(clientDir: string): Manifest {
  const file = readdirSync(path.join(clientDir, "assets")).find((name) => /^manifest-.*\.js$/.test(name));
  if (!file) throw new Error(`No route manifest in ${clientDir}/assets`);
  const text = readFileSync(path.join(clientDir, "assets", file), "utf8");
  return JSON.parse(text.slice(text.indexOf("=") + 1).replace(/;\s*$/, "")) as Manifest;
}

export async function bundle() {
  console.log(`\n== JavaScript per page before it is interactive (gzip), target ${TARGET_KB} kB for intake and quick sizing ==`);
  const clientDir = path.join(await buildForBench(), "client");
  const manifest = readManifest(clientDir);
  const gzipped = new Map<string, number>();
  const sizeOf = (asset: string) => {
    if (!gzipped.has(asset)) gzipped.set(asset, gzipSync(readFileSync(path.join(clientDir, asset))).length);
    return gzipped.get(asset)!;
  };
  const filesOf = (entry: ManifestEntry) => [entry.module, ...(entry.imports ?? [])];
  const shared = [...filesOf(manifest.entry), ...filesOf(manifest.routes.root)];
  const pages = Object.entries(manifest.routes)
    .filter(([id, route]) => id !== "root" && route.hasDefaultExport)
    .map(([id, route]) => ({ id, kB: [...new Set([...shared, ...filesOf(route)])].reduce((sum, asset) => sum + sizeOf(asset), 0) / 1000 }))
    .sort((a, b) => b.kB - a.kB);
  for (const { id, kB } of pages) {
    const target = TARGET_ROUTES.includes(id) ? (kB <= TARGET_KB ? "  target met" : `  over the target by ${(kB - TARGET_KB).toFixed(1)} kB`) : "";
    console.log(`${id.replace("routes/", "").padEnd(28)} ${kB.toFixed(1).padStart(6)} kB${target}`);
  }
  // The largest chunks, to see what a page's figure is made of.
  console.log(
    "largest chunks:",
    [...gzipped.entries()]
      .sort((a, b) => b[1] - a[1])
      .slice(0, 8)
      .map(([asset, bytes]) => `${path.basename(asset)} ${(bytes / 1000).toFixed(1)} kB`)
      .join(", "),
  );
}
