import type { Args } from './args.ts';
import type { Out } from './output.ts';

/** One planner command. `run` returns the exit status; thrown UsageError/RangeError become status 2. */
export interface Command {
  name: string;
  summary: string;
  usage: string;
  /** Flags that take no value. `json` is always a switch. */
  switches?: readonly string[];
  run(args: Args, out: Out): Promise<number> | number;
}
