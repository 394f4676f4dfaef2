import { z } from 'zod';

/** Finite numbers only: NaN and Infinity never cross the boundary. */
export const finite = z.number().refine(Number.isFinite, 'expected a finite number');
export const nonNegativeInt = z.number().int().nonnegative();
export const positiveInt = z.number().int().positive();
export const empty = z.object({}).strict();
