import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './App';
import { HostProvider } from './host-context';
import './styles.css';

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <HostProvider>
      <App />
    </HostProvider>
  </StrictMode>,
);
