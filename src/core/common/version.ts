import { version } from '../../../package.json';

/** The program's version, read from package.json so no file repeats it by hand. */
export const STRATPLOT_VERSION: string = version;
