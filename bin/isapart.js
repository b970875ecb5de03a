#!/usr/bin/env node
// isapart command line entry: runs the compiled CLI.
import { main } from '../dist/cli/main.js';

// A reader that stops early (`isapart check --help | head`) closes the pipe: stop quietly, as
// command-line tools do, instead of failing on the write.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (error) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
}

process.exitCode = await main(process.argv.slice(2));
