import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { requireArea } from '../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireArea(queryClient, request, 'reports');
    return null;
  };

export default function ReportsRoute() {
  return (
    <>
      <PageHeader title="Reports" lead="Win rate and revenue by salesperson, by option and by month." />
      <EmptyState title="Nothing to report yet">
        Figures appear once your team has issued proposals and customers have answered them.
      </EmptyState>
    </>
  );
}
