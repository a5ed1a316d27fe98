import { createRoot } from 'react-dom/client';
import { App } from './ui/App.tsx';
import { registerOfflineCache } from './ui/offline.ts';

registerOfflineCache();
createRoot(document.getElementById('root')!).render(<App />);
