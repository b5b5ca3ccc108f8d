import type { User } from '@contracts/auth';
import { useMe } from '@/features/auth/api/get-me';

/** For pages behind RequireAuth, which renders them only once the person is known. */
export function useCurrentUser(): User {
  const me = useMe();
  if (!me.data) throw new Error('useCurrentUser used outside RequireAuth.');
  return me.data;
}
