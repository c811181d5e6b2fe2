import { createContext, use } from 'react';
import type { Me } from '../api/types';

/** The signed-in user, provided by the app shell to every page inside it. */
export const MeContext = createContext<Me | null>(null);

export function useSignedInUser(): Me {
  const me = use(MeContext);
  if (!me) throw new Error('useSignedInUser is only available inside the app shell');
  return me;
}
