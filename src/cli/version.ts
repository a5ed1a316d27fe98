/** The planner's version: package.json's, read once (the bundle inlines it at build time). */
import pkg from '../../package.json' with { type: 'json' };

export const PLANNER_VERSION: string = pkg.version;
