// The client's initial JavaScript per route, from a real Vite build into a temp
// folder with a manifest: the entry chunk, the route's chunks (the layout for
// signed-in routes) and everything they import statically, each gzipped.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import os from 'node:os';
import path from 'node:path';

const ROOT = path.resolve(import.meta.dirname, '../..');

interface ManifestChunk {
  file: string;
  imports?: string[];
  isEntry?: boolean;
}

export interface RouteBundle {
  route: string;
  files: number;
  gzipBytes: number;
}

export async function measureBundles(): Promise<{ signIn: RouteBundle; largest: RouteBundle; routes: RouteBundle[] }> {
  const outDir = mkdtempSync(path.join(os.tmpdir(), 'whorl-bundle-'));
  try {
    const { build } = await import('vite');
    await build({
      root: ROOT,
      configFile: path.join(ROOT, 'vite.config.ts'),
      logLevel: 'error',
      build: { outDir, emptyOutDir: true, manifest: true },
    });
    const manifest = JSON.parse(readFileSync(path.join(outDir, '.vite/manifest.json'), 'utf8')) as Record<string, ManifestChunk>;
    const gzipped = new Map<string, number>();
    const sizeOf = (file: string) => {
      if (!gzipped.has(file)) gzipped.set(file, gzipSync(readFileSync(path.join(outDir, file))).length);
      return gzipped.get(file)!;
    };
    const collect = (key: string, into: Set<string>) => {
      const chunk = manifest[key];
      if (!chunk || into.has(chunk.file)) return;
      into.add(chunk.file);
      for (const imported of chunk.imports ?? []) collect(imported, into);
    };
    const entryKey = Object.keys(manifest).find((key) => manifest[key].isEntry)!;
    const routeKeys = Object.keys(manifest).filter((key) => key.startsWith('src/app/routes/') && key !== 'src/app/routes/signed-in-layout.tsx');
    const routes = routeKeys.map((key) => {
      const files = new Set<string>();
      collect(entryKey, files);
      if (!key.endsWith('sign-in.tsx')) collect('src/app/routes/signed-in-layout.tsx', files);
      collect(key, files);
      const js = [...files].filter((file) => file.endsWith('.js'));
      return { route: path.basename(key, '.tsx'), files: js.length, gzipBytes: js.reduce((sum, file) => sum + sizeOf(file), 0) };
    });
    routes.sort((a, b) => b.gzipBytes - a.gzipBytes);
    return { signIn: routes.find((route) => route.route === 'sign-in')!, largest: routes[0], routes };
  } finally {
    rmSync(outDir, { recursive: true, force: true });
  }
}
