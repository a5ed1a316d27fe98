import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'precision',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the precision command is not built yet');
  },
};
