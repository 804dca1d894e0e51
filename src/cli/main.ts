/** Entry point of the `seedsift` command: connects `run` to the real process. */
import { processIo } from './io.js';
import { run } from './program.js';

process.exitCode = await run(process.argv.slice(2), processIo());
