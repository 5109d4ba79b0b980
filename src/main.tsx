import '@fontsource/work-sans/400.css';
import '@fontsource/work-sans/500.css';
import '@fontsource/work-sans/600.css';
import '@fontsource/work-sans/700.css';
import './index.css';
import { createRoot } from 'react-dom/client';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';

const container = document.getElementById('root');
if (!container) throw new Error('The page has no #root element to mount Stillspan in.');

createRoot(container).render(
  <AppProvider>
    <AppRouter />
  </AppProvider>,
);
