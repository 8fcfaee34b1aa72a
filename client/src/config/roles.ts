import type { Role } from '@contract';

/** The words for each role (the list itself is the contract's ROLES). */
export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  estimator: 'Estimator',
  salesperson: 'Salesperson',
  installer: 'Installer',
};
