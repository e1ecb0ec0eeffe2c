/** The program's name and version, read from server/package.json when the program is bundled. */
import pkg from '../../package.json';

export const toolName = 'kernwright';
export const toolVersion: string = pkg.version;
