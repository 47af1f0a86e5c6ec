// Bump whenever any solver answer may change (constants, algorithms, tolerances, output fields):
// it is part of every scenario hash, so cached answers from older solvers are never served.
export const SOLVER_VERSION = '1.8.0';
