/** Exit codes of the command line: 0 done; 1 a gate failed (--fail-on); 2 usage or input error; 70 internal error. */
export const EXIT_DONE = 0;
export const EXIT_GATE = 1;
export const EXIT_USAGE = 2;
export const EXIT_INTERNAL = 70;
