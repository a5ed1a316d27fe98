import { UsageError } from '../args.ts';
import type { Command } from '../command.ts';

export const command: Command = {
  name: 'declination',
  summary: 'not built yet',
  usage: '',
  run() {
    throw new UsageError('the declination command is not built yet');
  },
};
