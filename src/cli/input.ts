/**
 * Input files for the planner: a path or `-` for standard input, read with a size cap (so `--tle /dev/zero` is
 * refused instead of hanging), and outputs that may not overwrite an input.
 */
import { closeSync, fstatSync, openSync, readSync, realpathSync } from 'node:fs';
import { resolve } from 'node:path';
import { UsageError, WorkError } from './args.ts';
import type { Out } from './output.ts';

/** Largest input file the planner reads, bytes (a year of element sets for thousands of satellites is ~10 MB). */
export const MAX_INPUT_BYTES = 64 * 1024 * 1024;

const mb = (n: number) => `${(n / 1024 / 1024).toFixed(0)} MB`;

function decode(bytes: Buffer, flag: string, name: string): string {
  const text = new TextDecoder('utf-8', { fatal: false }).decode(bytes);
  if (text.includes('\u0000')) throw new WorkError(`${flag} ${name} is not a text file (it holds NUL bytes)`);
  return text;
}

/** Read the text of `--flag PATH`; `-` reads standard input through `out.readStdin`. */
export async function readInputText(flag: string, path: string, out: Out, maxBytes = MAX_INPUT_BYTES): Promise<string> {
  if (path === '-') {
    if (!out.readStdin) throw new UsageError(`${flag} - (standard input) is not available here`);
    const bytes = await out.readStdin(maxBytes + 1);
    if (bytes.length > maxBytes) throw new WorkError(`${flag} standard input is larger than ${mb(maxBytes)}; give a smaller file`);
    return decode(bytes, flag, 'standard input');
  }
  let fd: number;
  try {
    fd = openSync(path, 'r');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EACCES' ? 'permission denied' : code === 'EISDIR' ? 'it is a folder' : (code ?? 'unreadable');
    throw new WorkError(`cannot read ${flag} file "${path}": ${why}`);
  }
  try {
    const st = fstatSync(fd);
    if (st.isDirectory()) throw new WorkError(`cannot read ${flag} file "${path}": it is a folder`);
    if (!st.isFile() && !st.isFIFO()) throw new WorkError(`cannot read ${flag} file "${path}": it is not a regular file`);
    if (st.isFile() && st.size > maxBytes) throw new WorkError(`${flag} file "${path}" is ${mb(st.size)}, larger than the ${mb(maxBytes)} the planner reads`);
    const chunks: Buffer[] = [];
    let total = 0;
    const buf = Buffer.alloc(1 << 20);
    for (;;) {
      const n = readSync(fd, buf, 0, buf.length, null);
      if (n === 0) break;
      chunks.push(Buffer.from(buf.subarray(0, n)));
      total += n;
      if (total > maxBytes) throw new WorkError(`${flag} file "${path}" is larger than the ${mb(maxBytes)} the planner reads`);
    }
    return decode(Buffer.concat(chunks), flag, `file "${path}"`);
  } catch (e) {
    if (e instanceof WorkError) throw e;
    throw new WorkError(`cannot read ${flag} file "${path}": ${(e as NodeJS.ErrnoException).code ?? 'unreadable'}`);
  } finally {
    closeSync(fd);
  }
}

const canonical = (p: string): string => {
  try {
    return realpathSync(p);
  } catch {
    return resolve(p);
  }
};

/** Refuse `--out PATH` when PATH is one of the input files (it would be overwritten before anyone noticed). */
export function assertOutIsNotInput(outPath: string, inputs: readonly { flag: string; path: string }[]): void {
  const o = canonical(outPath);
  for (const i of inputs) {
    if (i.path !== '-' && canonical(i.path) === o) throw new UsageError(`--out ${outPath} is the ${i.flag} input file; choose another output file`);
  }
}
