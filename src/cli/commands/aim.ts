import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'aim',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the aim command is not built yet');
  },
};
