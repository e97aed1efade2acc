// The Drizzle schema, one file per area; drizzle-kit reads this folder to generate `drizzle/`.
export * from './core';
export * from './auth';
export * from './catalogue';
export * from './sheets';
export * from './schedules';
export * from './apiTokens';
export * from './shares';
export * from './notifications';
