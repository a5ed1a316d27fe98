/**
 * `glintmark` — the command-line planner. Argument parsing and printing only; all numbers come from src/core.
 * Exit status: 0 success (no passes found is a result, not a failure); 1 the work failed (an unreadable or
 * oversized input file) or an internal error; 2 a usage error (one line on stderr naming the flag, no stack trace).
 */
import { Args, UsageError, WorkError, parseArgs } from './args.ts';
import type { Command } from './command.ts';
import { commands } from './commands/index.ts';
import { OPTION_DOCS } from './optionDocs.ts';
import { processOut, type Out } from './output.ts';
import { PLANNER_VERSION } from './version.ts';

function shortHelp(): string {
  const w = Math.max(...commands.map((c) => c.name.length));
  return [
    `glintmark ${PLANNER_VERSION} — plan corner-reflector aim, size and passes (angles in degrees, azimuths true, clockwise from north)`,
    '',
    'usage: glintmark <command> [options] [--json]',
    '',
    ...commands.map((c) => `  ${c.name.padEnd(w)}  ${c.summary}`),
    '',
    "glintmark help <command> (or glintmark <command> --help) shows a command's options, units and defaults.",
    'glintmark --version prints the version. Exit status: 0 done, 1 the work failed, 2 a usage error.',
    '',
  ].join('\n');
}

function commandHelp(cmd: Command): string {
  const lines = [`usage: glintmark ${cmd.name} ${cmd.usage}`, cmd.summary];
  const docs = OPTION_DOCS[cmd.name];
  if (docs?.length) {
    const w = Math.max(...docs.map((d) => d.flag.length));
    lines.push('', 'options:', ...docs.map((d) => `  ${d.flag.padEnd(w)}  ${d.text}${d.default !== undefined ? ` (default ${d.default})` : ''}`));
  }
  return lines.join('\n') + '\n';
}

const unknownCommand = (name: string) => `glintmark: unknown command "${name}"; try: ${commands.map((c) => c.name).join(', ')}\n`;

export async function main(argv: readonly string[], out: Out = processOut): Promise<number> {
  const [name, ...rest] = argv;
  if (name === '--version' || name === '-V' || name === 'version') {
    out.stdout(`glintmark ${PLANNER_VERSION}\n`);
    return 0;
  }
  if (!name || name === '--help' || name === '-h' || (name === 'help' && rest.length === 0)) {
    out.stdout(shortHelp());
    return 0;
  }
  if (name === 'help') {
    const cmd = commands.find((c) => c.name === rest[0]);
    if (!cmd) {
      out.stderr(unknownCommand(rest[0]));
      return 2;
    }
    out.stdout(commandHelp(cmd));
    return 0;
  }
  const cmd = commands.find((c) => c.name === name);
  if (!cmd) {
    out.stderr(unknownCommand(name));
    return 2;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    out.stdout(commandHelp(cmd));
    return 0;
  }
  let args: Args | undefined;
  try {
    args = new Args(parseArgs(rest, ['json', ...(cmd.switches ?? [])]));
    return await cmd.run(args, out);
  } catch (e) {
    if (e instanceof WorkError) {
      out.stderr(`glintmark ${cmd.name}: ${oneLine(e.message)}\n`);
      return 1;
    }
    if (e instanceof UsageError || isInputCheck(e)) {
      out.stderr(`glintmark ${cmd.name}: ${oneLine(nameTheFlag(e.message, args?.given() ?? []))}\n`);
      return 2;
    }
    const detail = e instanceof Error ? `${e.name}: ${e.message}` : String(e);
    out.stderr(`glintmark ${cmd.name}: internal error (a fault in glintmark, not in your input): ${oneLine(detail)}\n`);
    return 1;
  }
}

/**
 * The core's boundary checks throw RangeError, or TypeError with a "<name> must …" sentence (src/core/validate.ts).
 * Any other TypeError ("Cannot read properties of undefined", "x is not a function") is a fault in the code.
 */
function isInputCheck(e: unknown): e is RangeError | TypeError {
  if (e instanceof RangeError) return true;
  return e instanceof TypeError && /^\S+ (must|needs|is not a valid)\b/.test(e.message);
}

const UNIT_SUFFIX = /(Deg|Rad|M2|Km|Ms|Db|Dbsm|Hz|Nt|M)$/;
/**
 * A core message names its parameter ("incidenceDeg must be in (0, 90)°"); say it as the flag the user typed
 * ("--incidence must be …") when that flag was given, so the message points at what to change.
 */
export function nameTheFlag(message: string, given: readonly string[]): string {
  const m = /^([a-z][A-Za-z0-9]*)\b/.exec(message);
  if (!m || message.startsWith('--')) return message;
  const flag = m[1].replace(UNIT_SUFFIX, '').replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`);
  return given.includes(flag) ? `--${flag}${message.slice(m[1].length)}` : message;
}

const oneLine = (s: string) => s.replace(/\s*\n\s*/g, '; ');
