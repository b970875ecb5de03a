#!/usr/bin/env node
// isapart command line entry: runs the compiled CLI.
import { main } from '../dist/cli/main.js';

process.exitCode = await main(process.argv.slice(2));
