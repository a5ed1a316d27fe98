import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'bearing',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the bearing command is not built yet');
  },
};
