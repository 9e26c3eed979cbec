import { createContext, useContext } from 'react';
import type { SessionUser } from '@contracts/auth';

/** The signed-in user, provided by the shell once GET /api/auth/me has answered. */
export const SessionUserContext = createContext<SessionUser | null>(null);

/** The signed-in user. Only pages inside the shell call this, so there always is one. */
export function useSessionUser(): SessionUser {
  const user = useContext(SessionUserContext);
  if (!user) throw new Error('useSessionUser was called outside the signed-in shell.');
  return user;
}
