// The sheet format, version 1: schemas, types, terminals, reading, validation and migration.
export * from './schema';
export * from './terminals';
export * from './issues';
export * from './validate';
export * from './references';
export * from './migrate';
export * from './read';
