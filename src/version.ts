/** The tamis version, recorded in every output file. Keep in step with package.json (a test checks). */
export const VERSION = '0.1.0';
