import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'orient',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the orient command is not built yet');
  },
};
