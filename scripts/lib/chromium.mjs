// The e2e tier drives Debian's Chromium; it is installed with apt-get when missing (never a downloaded browser).
import { existsSync } from 'node:fs';
import { log } from './log.mjs';
import { aptInstall } from './postgres.mjs';

export const CHROMIUM_PATH = '/usr/bin/chromium';

export function ensureChromium() {
  if (existsSync(CHROMIUM_PATH)) return;
  if (process.getuid?.() !== 0) throw new Error(`${CHROMIUM_PATH} is missing: run \`sudo apt-get install -y chromium\``);
  log('e2e', 'installing Debian package chromium (one-off)…');
  aptInstall(['chromium', 'fonts-dejavu-core']);
}
