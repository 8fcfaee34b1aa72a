export const ROLES = ['owner', 'estimator', 'salesperson', 'installer'] as const;
export type Role = (typeof ROLES)[number];

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  estimator: 'Estimator',
  salesperson: 'Salesperson',
  installer: 'Installer',
};
