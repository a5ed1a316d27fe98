import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'plan',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the plan command is not built yet');
  },
};
