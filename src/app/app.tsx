import { RouterProvider } from 'react-router-dom';
import { useState } from 'react';
import { AppProvider, createQueryClient } from './provider';
import { createAppRouter } from './router';

export function App() {
  const [queryClient] = useState(createQueryClient);
  const [router] = useState(() => createAppRouter(queryClient));
  return (
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>
  );
}
