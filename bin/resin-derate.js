#!/usr/bin/env node
// Entry point of the CLI; the code is bundled to dist/cli.js by `npm run build` (run by `npm ci` too).
import { main } from '../dist/cli.js';

process.exitCode = await main(process.argv.slice(2), process.stdout, process.stderr);
