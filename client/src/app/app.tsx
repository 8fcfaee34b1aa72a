import { useState } from 'react';
import { RouterProvider } from 'react-router-dom';
import { AppUpdateBanner } from '../lib/offline/app-update';
import { queryClient } from '../lib/query-client';
import { AppProvider } from './provider';
import { createAppRouter } from './router';

export function App() {
  const [router] = useState(() => createAppRouter(queryClient));
  return (
    <AppProvider queryClient={queryClient}>
      <AppUpdateBanner />
      <RouterProvider router={router} />
    </AppProvider>
  );
}
