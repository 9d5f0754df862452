import 'server-only';
import pkg from '@/package.json' with { type: 'json' };

/** The product version, stamped into health answers, editions and packs. */
export const APP_VERSION: string = pkg.version;
