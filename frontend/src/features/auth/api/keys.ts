import { sessionKeys } from '@/lib/session';

export const authKeys = {
  me: sessionKeys.me,
};
