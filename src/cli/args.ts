/**
 * Minimal argument parsing for the planner: `--name value`, `--name=value`, repeatable flags and switches.
 * Every problem is a UsageError, which main() turns into one line on stderr and exit status 2.
 */
import { boundsText, inBounds } from '../data/schema/ranges.ts';
import { FLAG_BOUNDS } from './bounds.ts';
export class UsageError extends Error {
  override name = 'UsageError';
}

/** The command was understood but its work failed (an unreadable or oversized input file): exit status 1. */
export class WorkError extends Error {
  override name = 'WorkError';
}

export interface ParsedArgs {
  values: Map<string, string[]>;
  switches: Set<string>;
  positionals: string[];
}

/** Parse argv; `switchNames` are flags that take no value (e.g. json, tracks). */
export function parseArgs(argv: readonly string[], switchNames: readonly string[] = []): ParsedArgs {
  const values = new Map<string, string[]>();
  const switches = new Set<string>();
  const positionals: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (!a.startsWith('--')) {
      positionals.push(a);
      continue;
    }
    const eq = a.indexOf('=');
    const name = eq >= 0 ? a.slice(2, eq) : a.slice(2);
    if (!name) throw new UsageError(`empty option name in "${a}"`);
    if (switchNames.includes(name)) {
      if (eq >= 0) throw new UsageError(`--${name} takes no value`);
      switches.add(name);
      continue;
    }
    let v: string;
    if (eq >= 0) v = a.slice(eq + 1);
    else {
      if (i + 1 >= argv.length) throw new UsageError(`--${name} needs a value`);
      v = argv[++i];
    }
    const list = values.get(name) ?? [];
    list.push(v);
    values.set(name, list);
  }
  return { values, switches, positionals };
}

/** Accessors that turn missing, repeated or malformed values into UsageErrors naming the flag. */
export class Args {
  private readonly used = new Set<string>();
  constructor(private readonly parsed: ParsedArgs) {}

  has(name: string): boolean {
    return this.parsed.values.has(name) || this.parsed.switches.has(name);
  }
  flag(name: string): boolean {
    this.used.add(name);
    return this.parsed.switches.has(name);
  }
  optString(name: string): string | undefined {
    this.used.add(name);
    const v = this.parsed.values.get(name);
    if (!v) return undefined;
    if (v.length > 1) throw new UsageError(`--${name} given ${v.length} times; give it once`);
    return v[0];
  }
  string(name: string): string {
    const v = this.optString(name);
    if (v === undefined) throw new UsageError(`missing --${name}`);
    return v;
  }
  strings(name: string): string[] {
    this.used.add(name);
    return this.parsed.values.get(name) ?? [];
  }
  optNumber(name: string): number | undefined {
    const s = this.optString(name);
    if (s === undefined) return undefined;
    return checkFlagBounds(name, parseNumber(`--${name}`, s));
  }
  number(name: string): number {
    const s = this.string(name);
    return checkFlagBounds(name, parseNumber(`--${name}`, s));
  }
  /** Every flag the user typed (for naming them in messages). */
  given(): string[] {
    return [...this.parsed.values.keys(), ...this.parsed.switches];
  }
  /** Values of every flag whose name is in `names`, e.g. the input files. */
  valuesOf(names: readonly string[]): string[] {
    return names.flatMap((n) => this.parsed.values.get(n) ?? []);
  }
  /** Plain arguments (not options), e.g. a sub-command or a file name; reading them marks them expected. */
  positionals(): string[] {
    this.positionalsUsed = true;
    return [...this.parsed.positionals];
  }
  private positionalsUsed = false;
  /** Reject options nobody asked for (a typo must not be silently ignored). */
  assertNoUnknown(): void {
    for (const k of [...this.parsed.values.keys(), ...this.parsed.switches]) {
      if (!this.used.has(k)) throw new UsageError(`unknown option --${k}`);
    }
    if (!this.positionalsUsed && this.parsed.positionals.length) throw new UsageError(`unexpected argument "${this.parsed.positionals[0]}"`);
  }
}

/** The flag's plausible range (bounds.ts), if it has one: a value outside it is a UsageError naming the flag. */
function checkFlagBounds(name: string, x: number): number {
  const b = FLAG_BOUNDS[name];
  if (b && !inBounds(x, b)) throw new UsageError(`--${name} must be in ${boundsText(b)}, got ${x}`);
  return x;
}

/** A decimal number (no hex, no empty string, no trailing junk). */
export function parseNumber(label: string, s: string): number {
  const t = s.trim();
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t)) {
    throw new UsageError(`${label} must be a number, got "${s}"`);
  }
  return Number(t);
}
