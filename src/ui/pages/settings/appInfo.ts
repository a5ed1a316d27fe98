/** The app's version as written into backups (from package.json at build time). */
import { version } from '../../../../package.json';

export const APP_VERSION: string = version;
