import { sessionKeys } from '@/lib/session';

/** The account is the signed-in person, so its cache entry is the shared session one. */
export const accountKeys = {
  me: sessionKeys.me,
  tokens: () => ['account', 'tokens'] as const,
};
