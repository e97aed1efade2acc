/** `lib/schedule` — schedules of many circuits: file columns, row validation, families, sizing of one row, results. Pure TypeScript. */
export * from './columns';
export * from './families';
export * from './row';
export * from './files';
export * from './size';
export * from './results';
export * from './toSheet';
export * from './stateWords';
