import type { Command } from '../command.ts';
import { command as aim } from './aim.ts';
import { command as rcs } from './rcs.ts';
import { command as misalign } from './misalign.ts';
import { command as size } from './size.ts';
import { command as precision } from './precision.ts';
import { command as compromise } from './compromise.ts';
import { command as plan } from './plan.ts';
import { command as passes } from './passes.ts';
import { command as orient } from './orient.ts';
import { command as declination } from './declination.ts';
import { command as sun } from './sun.ts';
import { command as bearing } from './bearing.ts';
import { command as layout } from './layout.ts';
import { command as transform } from './transform.ts';
import { command as apex } from './apex.ts';
import { command as horizon } from './horizon.ts';
import { command as clearance } from './clearance.ts';
import { command as serve } from './serve.ts';
import { command as team } from './team.ts';
import { command as push } from './push.ts';
import { command as pull } from './pull.ts';

/** Every planner command, in the order `glintmark --help` lists them. */
export const commands: readonly Command[] = [aim, rcs, misalign, size, precision, compromise, plan, passes, orient, declination, sun, bearing, layout, transform, apex, horizon, clearance, serve, team, push, pull];
