import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App, createAppClients, firstPageLoaded } from './app/provider';
import { takeFirstGlance } from './lib/first-glance';
import { registerServiceWorker } from './lib/service-worker';
import './index.css';

const clients = createAppClients(takeFirstGlance());
void firstPageLoaded(clients).then(() =>
  createRoot(document.getElementById('root')!).render(
    <StrictMode>
      <App clients={clients} />
    </StrictMode>,
  ),
);

registerServiceWorker();
