import { useState } from 'react';
import { RouterProvider } from 'react-router-dom';
import { queryClient } from '../lib/query-client';
import { AppProvider } from './provider';
import { createAppRouter } from './router';

export function App() {
  const [router] = useState(() => createAppRouter(queryClient));
  return (
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>
  );
}
