import { closeSync, fsyncSync, openSync, renameSync, writeSync } from 'node:fs';
import path from 'node:path';
import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';
import { readPasswordStdin, readServer } from '../register.ts';
import { RegisterRefusal, withSession } from '../registerClient.ts';

export const command: Command = {
  name: 'pull',
  summary: 'write the whole team register as a phone backup file (photos included), restorable on a new phone',
  usage: '--server URL --email E --password-stdin --out FILE.json [--json]',
  switches: ['password-stdin'],
  async run(args, out) {
    const json = args.flag('json');
    const server = readServer(args);
    const email = args.string('email');
    if (!args.flag('password-stdin')) throw new UsageError('the password is read from standard input: give --password-stdin');
    const file = path.resolve(args.string('out'));
    args.assertNoUnknown();
    const password = await readPasswordStdin();
    try {
      const text = await withSession(server, email, password, 'pull', async (authed) => (await authed('/backup')).text());
      const doc = JSON.parse(text) as { tables: Record<string, unknown[]> };
      // Written whole to a temporary name, flushed, then renamed: a cut-off pull never leaves half a backup.
      const tmp = `${file}.${process.pid}.tmp`;
      const fd = openSync(tmp, 'w');
      try {
        writeSync(fd, text);
        fsyncSync(fd);
      } finally {
        closeSync(fd);
      }
      renameSync(tmp, file);
      const counts = Object.fromEntries(Object.entries(doc.tables).map(([t, rows]) => [t, rows.length]));
      out.stdout(json ? JSON.stringify({ out: file, counts }, null, 2) + '\n' : `wrote ${file}: ${Object.entries(counts).map(([t, n]) => `${n} ${t}`).join(', ')}\n`);
      return 0;
    } catch (e) {
      if (e instanceof RegisterRefusal) {
        out.stderr(`glintmark pull: ${e.message} (${e.code})\n`);
        return 2;
      }
      throw e;
    }
  },
};
