import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider } from 'react-router-dom';
import './styles/fonts.css';
import './styles/app.css';
import { AppProviders, createQueryClient } from './app/providers';
import { createAppRouter } from './app/router';
import { TopLevelBoundary } from './app/top-level-boundary';

const container = document.getElementById('root');
if (!container) throw new Error('index.html has no #root element.');

const queryClient = createQueryClient();
const router = createAppRouter();

createRoot(container).render(
  <StrictMode>
    <TopLevelBoundary>
      <AppProviders client={queryClient}>
        <RouterProvider router={router} />
      </AppProviders>
    </TopLevelBoundary>
  </StrictMode>,
);
