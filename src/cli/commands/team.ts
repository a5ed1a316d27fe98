import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';
import { readLocation, readPasswordStdin } from '../register.ts';

export const command: Command = {
  name: 'team',
  summary: 'manage the team register\'s members on this machine: add-member, list, remove-member',
  usage:
    'add-member --email E --role lead|crew|viewer [--data DIR | --database-url URL] --password-stdin\n' +
    '       glintmark team list [--data DIR | --database-url URL] [--json]\n' +
    '       glintmark team remove-member --email E [--data DIR | --database-url URL]\n' +
    '  the first member of an empty register must be a lead; an embedded register (--data) must not be open in a running server',
  switches: ['password-stdin'],
  async run(args, out) {
    const [sub, ...extra] = args.positionals();
    if (extra.length) throw new UsageError(`unexpected argument "${extra[0]}"`);
    if (sub !== 'add-member' && sub !== 'list' && sub !== 'remove-member') throw new UsageError('give a sub-command: add-member, list or remove-member');
    const json = args.flag('json');
    const loc = readLocation(args);
    const email = sub === 'list' ? undefined : args.string('email');
    const role = sub === 'add-member' ? args.string('role') : undefined;
    const fromStdin = args.flag('password-stdin');
    if (sub === 'add-member' && !fromStdin) throw new UsageError('add-member reads the password from standard input: give --password-stdin');
    args.assertNoUnknown();
    const password = sub === 'add-member' ? await readPasswordStdin() : '';

    const { openDatabase } = await import('../../server/db.ts');
    const { PhotoStore } = await import('../../server/photoStore.ts');
    const { Register } = await import('../../server/register.ts');
    const { RegisterError } = await import('../../server/errors.ts');
    const db = await openDatabase(loc);
    try {
      const reg = await Register.open(db, { photos: new PhotoStore(loc.dataDir) });
      if (sub === 'add-member') {
        const m = await reg.addMember(email as string, role as string, password);
        out.stdout(json ? JSON.stringify({ member: m }, null, 2) + '\n' : `added ${m.email} as ${m.role} (member ${m.id})\n`);
      } else if (sub === 'list') {
        const ms = await reg.listMembers();
        out.stdout(json ? JSON.stringify({ members: ms }, null, 2) + '\n' : ms.map((m) => `${m.email}\t${m.role}\t${m.id}\n`).join('') || 'no members yet\n');
      } else {
        const m = (await reg.listMembers()).find((x) => x.email.toLowerCase() === (email as string).trim().toLowerCase());
        if (!m) throw new UsageError(`${email} is not a member of this register`);
        await reg.removeMember(m.id);
        out.stdout(`removed ${m.email}; their device sign-ins are revoked\n`);
      }
      return 0;
    } catch (e) {
      if (e instanceof RegisterError) {
        out.stderr(`glintmark team: ${e.message}\n`);
        return 2;
      }
      throw e;
    } finally {
      await db.close();
    }
  },
};
