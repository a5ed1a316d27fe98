import { readFileSync } from 'node:fs';
import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';
import { readPasswordStdin, readServer } from '../register.ts';
import { RegisterRefusal, withSession } from '../registerClient.ts';

interface TableReport {
  added: number;
  updated: number;
  unchanged: number;
  localNewer: number;
  conflicts: { table: string; id: string; reason: string }[];
}

export function reportTable(report: Record<string, TableReport>): string {
  const rows = Object.entries(report).map(([t, r]) => [t, r.added, r.updated, r.unchanged, r.localNewer, r.conflicts.length].map(String));
  const head = ['table', 'added', 'updated', 'unchanged', 'register newer', 'conflicts'];
  const w = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (r: string[]) => r.map((c, i) => (i === 0 ? c.padEnd(w[i]) : c.padStart(w[i]))).join('  ');
  const conflicts = Object.values(report).flatMap((r) => r.conflicts.map((c) => `  conflict: ${c.table} ${c.id}: ${c.reason}`));
  return [line(head), ...rows.map(line), ...conflicts].join('\n') + '\n';
}

export const command: Command = {
  name: 'push',
  summary: 'load a phone backup file (JSON, or the ZIP archive) into the team register and print the merge report',
  usage: '--server URL --email E --password-stdin BACKUP [--json]',
  switches: ['password-stdin'],
  async run(args, out) {
    const json = args.flag('json');
    const server = readServer(args);
    const email = args.string('email');
    if (!args.flag('password-stdin')) throw new UsageError('the password is read from standard input: give --password-stdin');
    const files = args.positionals();
    args.assertNoUnknown();
    if (files.length !== 1) throw new UsageError('give exactly one backup file');
    let bytes: Buffer;
    try {
      bytes = readFileSync(files[0]);
    } catch {
      throw new UsageError(`cannot read the backup file ${files[0]}`);
    }
    const zip = bytes.length >= 2 && bytes[0] === 0x50 && bytes[1] === 0x4b; // "PK": a ZIP archive
    const password = await readPasswordStdin();
    try {
      const report = await withSession(server, email, password, 'push', async (authed) => {
        const res = await authed('/backup', {
          method: 'POST',
          headers: { 'Content-Type': zip ? 'application/zip' : 'application/json; charset=utf-8' },
          body: zip ? new Uint8Array(bytes) : bytes.toString('utf8'),
        });
        return ((await res.json()) as { report: Record<string, TableReport> }).report;
      });
      out.stdout(json ? JSON.stringify({ report }, null, 2) + '\n' : reportTable(report));
      return 0;
    } catch (e) {
      if (e instanceof RegisterRefusal) {
        out.stderr(`glintmark push: nothing was changed: ${e.message} (${e.code})\n`);
        return 2;
      }
      throw e;
    }
  },
};
