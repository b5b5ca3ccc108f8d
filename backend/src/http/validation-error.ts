import type { z } from 'zod';
import { AppError } from './errors';

/** Turns zod issues into one readable sentence: "email: Enter a valid e-mail address." */
export function validationError(error: z.ZodError, where: 'body' | 'query'): AppError {
  const parts = error.issues.slice(0, 5).map((issue) => {
    const field = issue.path.join('.');
    if (issue.code === 'unrecognized_keys') return `unexpected field(s) ${issue.keys.join(', ')}`;
    return field ? `${field}: ${issue.message}` : issue.message;
  });
  const prefix = where === 'query' ? 'Invalid query: ' : '';
  return new AppError(400, 'invalid_input', prefix + parts.join('; '));
}
