import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'passes',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the passes command is not built yet');
  },
};
