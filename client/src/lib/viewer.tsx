import { createContext, useContext } from 'react';
import type { Role } from '../config/roles';

/** Who is looking: enough for a feature to hide what the server would refuse. */
export interface Viewer {
  readonly id: string;
  readonly role: Role;
}

/**
 * Given by the signed-in shell (app/routes/app-root.tsx), so features need not import the auth
 * feature. The server decides; this only keeps buttons away from people they would fail for.
 */
export const ViewerContext = createContext<Viewer | null>(null);

export function useViewer(): Viewer | null {
  return useContext(ViewerContext);
}

/** The owner and estimator run the office: they assign people and may act on every job. */
export const isOffice = (v: Viewer | null): boolean => v?.role === 'owner' || v?.role === 'estimator';
