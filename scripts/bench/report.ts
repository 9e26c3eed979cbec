import { mkdirSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';

export function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Writes one benchmark's figures to bench-output/<name>.json; scripts/bench/write-report.ts
 * gathers them into docs/performance.md with the machine they ran on. */
export function recordFigures(name: string, rows: Array<[string, string]>): void {
  const dir = path.resolve(import.meta.dirname, '../../bench-output');
  mkdirSync(dir, { recursive: true });
  const machine = `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'cpu'}, ${(os.totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}, ${os.platform()} ${os.release()}`;
  writeFileSync(path.join(dir, `${name}.json`), JSON.stringify({ name, at: new Date().toISOString(), machine, rows }, null, 2));
}

export function readFigures(name: string): { name: string; at: string; machine: string; rows: Array<[string, string]> } | null {
  const file = path.resolve(import.meta.dirname, '../../bench-output', `${name}.json`);
  return existsSync(file) ? JSON.parse(readFileSync(file, 'utf8')) : null;
}
