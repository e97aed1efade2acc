/** `lib/sheet` — the sizing sheet as data: inputs schema, review states, sizing conversion, result snapshot. Pure TypeScript. */
export * from './schema';
export * from './candidates';
export * from './stateMachine';
export * from './toSizing';
export * from './compute';
export * from './snapshot';
export * from './formUnits';
export * from './beyondSteady';
export * from './enclosureAir';
export * from './optionalChecksReport';
export * from './groupWords';
export * from './reEvaluation';
export * from './arrangementCheck';
export * from './crossSection';
export * from './crossSectionField';
export * from './fieldPicture';
