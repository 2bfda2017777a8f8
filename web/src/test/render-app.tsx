import { cleanup, configure, render } from '@testing-library/react';
import { createMemoryRouter } from 'react-router';
import { afterEach, vi } from 'vitest';
import { createShadowloopApp } from '../app/create-app';
import { AppProvider } from '../app/provider';
import { forgetCsrfToken } from '../lib/api';
import { keepSocketsOffline } from './fake-socket';

// The whole app renders with lazy routes; on a loaded 2-core runner a page can take over the
// default second to appear, which is slowness, not a fault the test looks for.
configure({ asyncUtilTimeout: 5000 });

afterEach(() => {
  cleanup();
  forgetCsrfToken();
  vi.unstubAllGlobals();
});

/** Renders the whole app, routes and all, at a path, with a query client that never retries and no live connection. */
export function renderApp(path: string) {
  keepSocketsOffline();
  const app = createShadowloopApp({
    createRouter: (routes) => createMemoryRouter(routes, { initialEntries: [path] }),
    queryClient: { retry: false },
  });
  const view = render(<AppProvider app={app} />);
  return { ...view, ...app };
}
