import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { ReportsPage } from '../../features/reports/components/reports-page';
import { requireArea } from '../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireArea(queryClient, request, 'reports');
    return null;
  };

export default function ReportsRoute() {
  return <ReportsPage />;
}
