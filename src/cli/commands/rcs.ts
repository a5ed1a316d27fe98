import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'rcs',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the rcs command is not built yet');
  },
};
