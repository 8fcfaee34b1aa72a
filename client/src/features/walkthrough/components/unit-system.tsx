import { createContext, useContext } from 'react';
import type { UnitSystem } from '@contract';

/** The company's unit system (company settings); imperial when unknown. */
export const UnitSystemContext = createContext<UnitSystem>('imperial');

export function useUnitSystem(): UnitSystem {
  return useContext(UnitSystemContext);
}
