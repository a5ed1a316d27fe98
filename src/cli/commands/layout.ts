import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'layout',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the layout command is not built yet');
  },
};
