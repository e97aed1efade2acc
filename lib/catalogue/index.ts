/**
 * `lib/catalogue` — pure helpers for the team catalogue: row schemas (zod) shared by the grid,
 * the API and imports; column descriptions; file reading and writing; and the mapping from
 * catalogue rows to the sizing library's Candidate. No React, Next.js or database here.
 * (The file helpers live in `lib/catalogue/files` so that the browser bundle does not pull exceljs.)
 */
export * from './schemas';
export * from './columns';
export * from './decimal';
export * from './candidate';
