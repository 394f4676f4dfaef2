import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './App';
import { HostProvider } from './host-context';
import { LabProvider } from './lab/lab-context';
import './styles.css';

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <HostProvider>
      <LabProvider>
        <App />
      </LabProvider>
    </HostProvider>
  </StrictMode>,
);
