import { onlineManager, type QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { EDITORS } from '@calc';
import { PageHeader } from '../../components/ui/page-header';
import { useSignedIn } from '../../features/auth/api/get-me';
import { PriceBookPage } from '../../features/price-book/components/price-book-page';
import { requireArea } from '../guards';
import { nothingHeldOffline } from '../../lib/offline/online';
import { priceBookKeys } from '../../features/price-book/query-keys';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireArea(queryClient, request, 'price-book');
    // With no signal and no table held on the device: "No signal" in words at once, not a spinner with no end.
    const held = queryClient.getQueriesData({ queryKey: priceBookKeys.all }).some(([, data]) => data !== undefined);
    if (!held && !onlineManager.isOnline()) throw nothingHeldOffline();
    return null;
  };

export default function PriceBookRoute() {
  const { user } = useSignedIn();
  const office = EDITORS.includes(user.role);
  return (
    <>
      <PageHeader
        title={office ? 'Price book & catalog' : 'Equipment catalog'}
        lead={
          office
            ? 'The equipment you offer and what your materials, labor and kits cost. Takeoffs are priced from here.'
            : 'The equipment your company offers and its specifications.'
        }
      />
      <PriceBookPage role={user.role} />
    </>
  );
}
