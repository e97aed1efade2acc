import type { VerificationCase } from '../types';

export const catalogueCases: VerificationCase[] = [];
