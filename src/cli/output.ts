/** Printing helpers: one JSON document with --json, otherwise an aligned plain-text table. */
export interface Out {
  stdout: (s: string) => void;
  stderr: (s: string) => void;
  /** Standard input, up to `maxBytes` (an input file given as `-`). */
  readStdin?: (maxBytes: number) => Promise<Buffer>;
  /** Whether stderr is a terminal (progress bars are drawn only then). */
  stderrIsTty?: boolean;
}

async function readProcessStdin(maxBytes: number): Promise<Buffer> {
  const chunks: Buffer[] = [];
  let total = 0;
  for await (const chunk of process.stdin) {
    const b = Buffer.isBuffer(chunk) ? chunk : Buffer.from(String(chunk));
    chunks.push(b);
    total += b.length;
    if (total >= maxBytes) break;
  }
  return Buffer.concat(chunks);
}

export const processOut: Out = {
  stdout: (s) => process.stdout.write(s),
  stderr: (s) => process.stderr.write(s),
  readStdin: readProcessStdin,
  stderrIsTty: process.stderr.isTTY === true,
};

/** Round for display only; JSON keeps full precision. */
export function fmt(x: unknown, digits = 3): string {
  if (typeof x === 'number') return Number.isFinite(x) ? x.toFixed(digits) : String(x);
  if (x === undefined || x === null) return '';
  return String(x);
}

/** Two-column "name  value" table for one result object. */
export function keyValueTable(rows: [string, string][]): string {
  const w = Math.max(...rows.map(([k]) => k.length));
  return rows.map(([k, v]) => `${k.padEnd(w)}  ${v}`).join('\n') + '\n';
}

/** Column table with a header row. */
export function table(header: string[], rows: string[][]): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (r: string[]) => r.map((c, i) => (c ?? '').padEnd(widths[i])).join('  ').trimEnd();
  return [line(header), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)].join('\n') + '\n';
}
