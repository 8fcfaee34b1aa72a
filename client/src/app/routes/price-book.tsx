import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { requireArea } from '../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireArea(queryClient, request, 'price-book');
    return null;
  };

export default function PriceBookRoute() {
  return (
    <>
      <PageHeader title="Price book & catalog" lead="Your material and labor prices, and the equipment you offer." />
      <EmptyState title="The price book is not editable here yet">
        Editing prices and equipment arrives in a later release. Takeoffs will be priced from what you enter here.
      </EmptyState>
    </>
  );
}
