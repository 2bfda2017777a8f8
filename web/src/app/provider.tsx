import { QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router';
import type { ShadowloopApp } from './create-app';

export function AppProvider({ app }: { app: ShadowloopApp }) {
  return (
    <QueryClientProvider client={app.queryClient}>
      <RouterProvider router={app.router} />
    </QueryClientProvider>
  );
}
