import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import '@fontsource-variable/inter';
import './index.css';
import { App } from './app/app';

const root = document.getElementById('root');
if (!root) throw new Error('index.html needs a #root element');

createRoot(root).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
