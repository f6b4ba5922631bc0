// Before the browser suite: the client and server-rendering bundles, built into dist-test/.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureBuilt } from '../../scripts/lib/build';

export const TEST_DIST_DIR = 'dist-test';
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export default function setup() {
  ensureBuilt(root, TEST_DIST_DIR, (msg) => console.log(`[e2e] ${msg}`));
}
