import '@fontsource/roboto-condensed/latin-400.css';
import '@fontsource/roboto-condensed/latin-500.css';
import '@fontsource/roboto-condensed/latin-700.css';
import './index.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { createShadowloopApp } from './app/create-app';
import { AppProvider } from './app/provider';

const container = document.getElementById('root');
if (!container) throw new Error('The page has no #root element to mount Shadowloop into.');

createRoot(container).render(
  <StrictMode>
    <AppProvider app={createShadowloopApp()} />
  </StrictMode>,
);
