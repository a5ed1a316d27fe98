/**
 * Build step that makes the web build work offline: after Vite writes the bundle, write `sw.js`, a service worker
 * that precaches every emitted file (and the app shell) under a cache named after a hash of the file list, serves
 * them cache-first, answers navigations with the cached shell, and never fetches from another origin.
 */
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import type { Plugin } from 'vite';

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? walk(p) : [p];
  });
}

export function offlinePlugin(): Plugin {
  let outDir = 'dist';
  return {
    name: 'glintmark-offline',
    apply: 'build',
    configResolved(c) {
      outDir = c.build.outDir;
    },
    closeBundle() {
      const files = walk(outDir)
        .map((p) => relative(outDir, p).split(sep).join('/'))
        .filter((p) => p !== 'sw.js' && !p.endsWith('.map'));
      const hash = createHash('sha256');
      for (const f of files.sort()) hash.update(f).update(readFileSync(join(outDir, f)));
      const version = hash.digest('hex').slice(0, 12);
      const urls = ['./', ...files.map((f) => './' + f)];
      const template = readFileSync(new URL('./sw-template.js', import.meta.url), 'utf8');
      writeFileSync(join(outDir, 'sw.js'), template.replace('__VERSION__', version).replace('__PRECACHE__', JSON.stringify(urls)));
    },
  };
}
