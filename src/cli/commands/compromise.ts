import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'compromise',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the compromise command is not built yet');
  },
};
