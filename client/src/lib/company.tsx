import { createContext, useContext } from 'react';

/**
 * The signed-in person's company as the shell knows it (app/routes/app-root.tsx provides it), for pages that
 * show it to customers, such as the printable load summary, without importing the auth feature.
 */
export type CompanyIdentity = { readonly id: string; readonly name: string };

export const CompanyContext = createContext<CompanyIdentity | null>(null);

/** The company's name; throws outside the signed-in shell, where there is no company to name. */
export function useCompanyName(): string {
  const company = useContext(CompanyContext);
  if (!company) throw new Error('This page needs the signed-in company.');
  return company.name;
}
