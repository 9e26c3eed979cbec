// Budget: the JavaScript a first page load needs (the entry chunk and everything it imports
// statically), gzip ≤ 200 KB. Reads Vite's manifest of the last build (dist/client/.vite/manifest.json).
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { recordFigures } from './report';

interface Chunk { file: string; isEntry?: boolean; imports?: string[]; dynamicImports?: string[]; css?: string[] }
const dist = path.resolve(import.meta.dirname, '../../dist/client');
const manifest = JSON.parse(readFileSync(path.join(dist, '.vite/manifest.json'), 'utf8')) as Record<string, Chunk>;
const entryKey = Object.keys(manifest).find((k) => manifest[k].isEntry)!;
const seen = new Set<string>();
const walk = (key: string) => {
  if (seen.has(key)) return;
  seen.add(key);
  for (const dep of manifest[key].imports ?? []) walk(dep);
};
walk(entryKey);
const gz = (file: string) => gzipSync(readFileSync(path.join(dist, file))).length;
const entryJs = [...seen].reduce((t, k) => t + gz(manifest[k].file), 0);
const lazy = Object.entries(manifest).filter(([k, c]) => !seen.has(k) && c.file.endsWith('.js'));
const biggest = lazy.map(([k, c]) => [k, gz(c.file)] as const).sort((a, b) => b[1] - a[1]).slice(0, 4);
const kb = (b: number) => `${(b / 1024).toFixed(1)} KB`;
console.log(`first load JS (entry + static imports, ${seen.size} chunks): ${kb(entryJs)} gzip (budget ≤ 200 KB)`);
for (const [k, b] of biggest) console.log(`  lazy: ${k} ${kb(b)} gzip`);
recordFigures('bundle', [
  [`first-load JavaScript, entry + ${seen.size - 1} static imports (gzip)`, `${kb(entryJs)} (budget ≤ 200 KB)`],
  ...biggest.map(([k, b]) => [`lazy chunk ${k}`, `${kb(b)} gzip`] as [string, string]),
]);
