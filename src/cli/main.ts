/** Entry point of the `seedsift` command: connects `run` to the real process. */
import { processIo } from './io.js';
import { run } from './program.js';

// A reader that stops early (`seedsift scan runs | head`) is not an error.
process.stdout.on('error', (error: NodeJS.ErrnoException) => {
  if (error.code === 'EPIPE') process.exit(0);
  throw error;
});

process.exitCode = await run(process.argv.slice(2), processIo());
