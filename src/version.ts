/** ephmap's version, generated from package.json by scripts/version.mjs (do not edit). */
export const VERSION = '0.1.0';
