/** The generator version printed in every emitted header (from package.json, read once). */
import { readFileSync } from 'node:fs';
import { PACKAGE_ROOT } from './package-root.js';

const pkg = JSON.parse(readFileSync(new URL('package.json', PACKAGE_ROOT), 'utf8')) as { version: string };

export const VERSION: string = pkg.version;
