/**
 * `glintmark` — the command-line planner. Argument parsing and printing only; all numbers come from src/core.
 * Exit status: 0 success, 2 bad input (one line on stderr, no stack trace), 1 unexpected failure.
 */
import { Args, UsageError, parseArgs } from './args.ts';
import { commands } from './commands/index.ts';
import { processOut, type Out } from './output.ts';

function help(): string {
  const w = Math.max(...commands.map((c) => c.name.length));
  return [
    'glintmark — plan corner-reflector aim, size and passes (angles in degrees, azimuths true, clockwise from north)',
    '',
    'usage: glintmark <command> [options] [--json]',
    '',
    ...commands.map((c) => `  ${c.name.padEnd(w)}  ${c.summary}`),
    '',
    'glintmark <command> --help shows a command\'s options.',
    '',
  ].join('\n');
}

export async function main(argv: readonly string[], out: Out = processOut): Promise<number> {
  const [name, ...rest] = argv;
  if (!name || name === '--help' || name === '-h' || name === 'help') {
    out.stdout(help());
    return name ? 0 : 2;
  }
  const cmd = commands.find((c) => c.name === name);
  if (!cmd) {
    out.stderr(`glintmark: unknown command "${name}"; try: ${commands.map((c) => c.name).join(', ')}\n`);
    return 2;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    out.stdout(`usage: glintmark ${cmd.name} ${cmd.usage}\n${cmd.summary}\n`);
    return 0;
  }
  try {
    const args = new Args(parseArgs(rest, ['json', ...(cmd.switches ?? [])]));
    return await cmd.run(args, out);
  } catch (e) {
    if (e instanceof UsageError || e instanceof RangeError || e instanceof TypeError) {
      out.stderr(`glintmark ${cmd.name}: ${oneLine(e.message)}\n`);
      return 2;
    }
    out.stderr(`glintmark ${cmd.name}: unexpected failure: ${oneLine(e instanceof Error ? e.message : String(e))}\n`);
    return 1;
  }
}

const oneLine = (s: string) => s.replace(/\s*\n\s*/g, '; ');
