#!/usr/bin/env node
// Entry point of the CLI; the code is bundled to dist/cli.js by `npm run build` (run by `npm ci` too).
import { runCli } from '../dist/cli.js';

await runCli();
