import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'misalign',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the misalign command is not built yet');
  },
};
