import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';

import '@/styles/index.css';

import { AppProvider } from '@/app/provider';
import { AppRouter } from '@/app/router';

const rootElement = document.getElementById('root');
if (!rootElement) throw new Error('index.html has no #root element to render Wardbook into.');

createRoot(rootElement).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
);
