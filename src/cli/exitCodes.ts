/**
 * Exit codes of the command line: 0 done; 1 a gate failed (--fail-on); 2 usage or input error;
 * 3 a --fail-on gate had nothing to judge (no comparison was made, or more than half of the files
 * could not be read), so it cannot pass; 70 internal error.
 */
export const EXIT_DONE = 0;
export const EXIT_GATE = 1;
export const EXIT_USAGE = 2;
export const EXIT_NO_EVIDENCE = 3;
export const EXIT_INTERNAL = 70;
