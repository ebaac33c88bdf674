// The solver's version, recorded with every issued revision so that a result can be traced to the code that made
// it. Raise it whenever a change can move a number the solver returns.
export const SOLVER_VERSION = '0.4.0';
