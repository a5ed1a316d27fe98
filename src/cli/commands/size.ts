import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'size',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the size command is not built yet');
  },
};
