import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'sun',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the sun command is not built yet');
  },
};
