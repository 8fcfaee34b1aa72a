import { createContext, useContext } from 'react';
import type { Viewer } from '@contract';

export type { Viewer };

/**
 * Who is looking, given by the signed-in shell (app/routes/app-root.tsx), so features need not import
 * the auth feature. The server decides; features read the contract's permission rules with this viewer
 * only to keep buttons away from people they would fail for.
 */
export const ViewerContext = createContext<Viewer | null>(null);

export function useViewer(): Viewer | null {
  return useContext(ViewerContext);
}
