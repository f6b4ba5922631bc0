// `npm run build`: the client and the server-rendering entry into dist/ (skipped when up to date).
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureBuilt } from './lib/build';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
ensureBuilt(root, process.argv[2] ?? 'dist', (msg) => console.log(`[rivet-reel] ${msg}`));
